package com.loopwright.api.design;

import java.util.List;

/** The cautions every design carries: it drives machines that move and vessels under pressure. */
public final class Cautions {

    public static final List<String> ALL = List.of(
            "Simulated results come from the nominal linear model; they are not a substitute for commissioning"
                    + " tests on the real machine or process.",
            "Actuator saturation, sampling, measurement noise, delay and model error are not in these results;"
                    + " start commissioning with reduced gains and limits.",
            "Keep interlocks, limit switches, safe torque off, relief valves and every other safety function in"
                    + " place; this design provides none of them.",
            "Follow local codes, machine-safety and pressure-equipment standards, and licensed engineering"
                    + " practice before energizing moving machinery or pressurized equipment.");

    private Cautions() {}
}
