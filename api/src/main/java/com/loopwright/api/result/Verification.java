package com.loopwright.api.result;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * Independent checks of the design.
 *
 * @param peakDisturbanceGain                  peak over frequency of the closed-loop gain from the disturbance w
 *                                             to the performance output z (the H-infinity norm of that loop)
 * @param peakDisturbanceGainFrequency         frequency where that gain peaks [rad/s]
 * @param peakDisturbanceGainRelativeTolerance order n only: peakDisturbanceGain is a certified upper bound at most
 *                                             a factor (1 + this) above the true peak
 * @param certified                            peakDisturbanceGain &lt;= gamma and the two Riccati solutions agree
 * @param positionPerDisturbanceBound          order 2 only: certified ||x1||_2 / ||w||_2 &lt;= gamma/rho1 (absent
 *                                             when rho1 = 0)
 * @param specsMet                             true when every spec check is met
 * @param specChecks                           each requested spec against its simulated value
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record Verification(
        double peakDisturbanceGain,
        double peakDisturbanceGainFrequency,
        Double peakDisturbanceGainRelativeTolerance,
        boolean certified,
        Double positionPerDisturbanceBound,
        boolean specsMet,
        List<SpecCheck> specChecks) {
    public Verification {
        specChecks = List.copyOf(specChecks);
    }
}
