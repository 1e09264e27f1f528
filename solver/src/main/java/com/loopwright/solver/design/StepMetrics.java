package com.loopwright.solver.design;

/**
 * Time-domain metrics of a step response, measured on the exact continuous solution.
 *
 * @param riseTimeSeconds time from first reaching 10% to first reaching 90% of the final value
 * @param settlingTimeSeconds last time |y - y_inf| exceeds the band fraction times |y_inf|
 * @param overshootPercent 100 (y_peak - y_inf) / |y_inf| in the direction of y_inf, 0 if the
 *     output never passes y_inf
 * @param peakTimeSeconds time of the largest output (signed towards y_inf) in [0, horizon]; for a
 *     response without overshoot this is where the output is largest inside the window, often the
 *     horizon itself
 * @param steadyStateError r - y_inf, in output units
 * @param peakControl max |u(t)| over (0, horizon], including the jump u(0+) = dControl r
 * @param finalValue y_inf = -cOut A^-1 bRef r, in output units
 * @param undershootPercent 100 max(0, -min y / y_inf) over [0, horizon]: the largest excursion
 *     opposite to the final value, refined between samples as the overshoot is
 */
public record StepMetrics(
        double riseTimeSeconds,
        double settlingTimeSeconds,
        double overshootPercent,
        double peakTimeSeconds,
        double steadyStateError,
        double peakControl,
        double finalValue,
        double undershootPercent) {

    public StepMetrics {
        requireFinite(riseTimeSeconds, "riseTimeSeconds");
        requireFinite(settlingTimeSeconds, "settlingTimeSeconds");
        requireFinite(overshootPercent, "overshootPercent");
        requireFinite(peakTimeSeconds, "peakTimeSeconds");
        requireFinite(steadyStateError, "steadyStateError");
        requireFinite(peakControl, "peakControl");
        requireFinite(finalValue, "finalValue");
        requireFinite(undershootPercent, "undershootPercent");
        if (riseTimeSeconds < 0.0
                || settlingTimeSeconds < 0.0
                || overshootPercent < 0.0
                || peakTimeSeconds < 0.0
                || peakControl < 0.0
                || undershootPercent < 0.0) {
            throw new IllegalArgumentException("times, overshoot, undershoot and peak control must be >= 0");
        }
    }

    private static void requireFinite(double value, String name) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException(name + " must be finite, got " + value);
        }
    }
}
