package com.loopwright.api.robustness;

import java.util.List;

/** The cautions every robustness result carries, beside the design cautions. */
public final class RobustnessCautions {

    public static final List<String> ALL = List.of(
            "These checks cover only the uncertainty ranges, disturbances, actuator limit, sampling and delay"
                    + " you asked for, on a second-order model; unmodelled dynamics (resonances, backlash, sensor"
                    + " filters) can still destabilize the real loop.",
            "A pass here is not a substitute for commissioning tests with reduced gains and limits, for"
                    + " interlocks and safety functions, or for local codes and licensed engineering practice.");

    private RobustnessCautions() {}
}
