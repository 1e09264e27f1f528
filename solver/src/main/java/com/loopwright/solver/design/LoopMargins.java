package com.loopwright.solver.design;

import java.util.List;

/**
 * Stability margins of the loop broken at the plant input, L(s) = K (sI - A)^-1 B2 = b (k1 + k2 s)/(s^2 + a1 s + a0).
 *
 * <p>Every gain crossover counts (the rule is frequency.CrossoverMargins): with lag_i = (180 + arg L(j w_i)) mod 360
 * degrees at crossover w_i, a stable closed loop has phase margin min_i lag_i and delay margin min_i lag_i / w_i.
 *
 * @param crossoverRadPerSec      the gain crossover |L| = 1 that sets the phase margin; null if |L| never equals 1
 * @param phaseMarginDegrees      least phase lag at the plant input that destabilizes, min over crossovers of
 *                                (180 + arg L) mod 360, in [0, 360) for the stable loops verified here; null
 *                                without a crossover
 * @param delayMarginSeconds      smallest input delay that destabilizes: min over crossovers of lag_i / omega_i
 *                                (radians over rad/s); null without a crossover
 * @param gainMargin              factor by which the loop gain can grow before instability (1/|L| at the phase
 *                                crossover with |L| &lt; 1); null when unbounded
 * @param gainMarginRadPerSec     the phase crossover that sets the gain margin; null without a gain margin
 * @param gainReductionMargin     factor by which the loop gain can shrink (1/|L| at a phase crossover with |L| &gt; 1,
 *                                below 1); null when unbounded
 * @param peakSensitivity         max |1/(1 + L(j omega))|
 * @param peakSensitivityRadPerSec where it peaks; null when the supremum 1 is only approached as w -> infinity
 * @param bandwidthRadPerSec      -3 dB frequency of the reference-to-x1 transfer b kr/(s^2 + c1 s + c0)
 * @param response                log-spaced frequency response (possibly empty)
 */
public record LoopMargins(
        Double crossoverRadPerSec,
        Double phaseMarginDegrees,
        Double delayMarginSeconds,
        Double gainMargin,
        Double gainMarginRadPerSec,
        Double gainReductionMargin,
        double peakSensitivity,
        Double peakSensitivityRadPerSec,
        double bandwidthRadPerSec,
        List<FrequencyPoint> response) {

    public LoopMargins {
        response = List.copyOf(response);
    }

    /**
     * True when no phase crossover (arg L = -180 deg) has |L| &lt; 1, so the loop gain can grow without bound and
     * the loop stays stable; then {@link #gainMargin()} is null.
     */
    public boolean gainMarginUnbounded() {
        return gainMargin == null;
    }
}
