package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.UncertainCase;

/**
 * The step metrics of one sampled case from its trajectory observed at and between the samples: rise time,
 * settling time, overshoot and peak command exactly as {@link GridMetrics} measures them (the numbers of a
 * verification's sampled section), plus the peak time (the grid point of the largest x1 / y_inf) and the undershoot
 * (100 max(0, -min x1 / y_inf)) that {@link StepMetrics} carries.
 */
final class SampledCaseMetrics {

    private SampledCaseMetrics() {}

    /**
     * @param finalValue y_inf, non-zero
     * @return the metrics, or null when x1 never reaches 90% of y_inf or is outside the band at the horizon
     */
    static StepMetrics of(DenseTrajectory trajectory, double finalValue, double stepSize, double bandFraction) {
        if (!(finalValue != 0) || !Double.isFinite(finalValue)) {
            return null;
        }
        GridMetrics grid = GridMetrics.of(trajectory, finalValue, bandFraction);
        if (grid.riseTimeSeconds() == null || grid.settlingTimeSeconds() == null) {
            return null;
        }
        double[] t = trajectory.timeSeconds();
        double[] y = trajectory.x1();
        double peak = Double.NEGATIVE_INFINITY;
        double lowest = 0;
        double peakTime = 0;
        for (int i = 0; i < t.length; i++) {
            double z = y[i] / finalValue;
            if (z > peak) {
                peak = z;
                peakTime = t[i];
            }
            lowest = Math.min(lowest, z);
        }
        return new StepMetrics(
                grid.riseTimeSeconds(),
                grid.settlingTimeSeconds(),
                grid.overshootPercent(),
                peakTime,
                stepSize - finalValue,
                grid.peakControl(),
                finalValue,
                100 * Math.max(0, -lowest));
    }

    /** One case for a report: unstable (not measured) when {@code m} is null, else its metrics against the limits. */
    static UncertainCase judged(
            CanonicalPlant plant, boolean corner, StepMetrics m, Double disturbanceGain, AcceptanceLimits limits) {
        if (m == null) {
            return new UncertainCase(plant, corner, false, null, null, null, null, disturbanceGain, false);
        }
        return new UncertainCase(
                plant,
                corner,
                true,
                m.settlingTimeSeconds(),
                m.riseTimeSeconds(),
                m.overshootPercent(),
                m.peakControl(),
                disturbanceGain,
                limits.met(m.settlingTimeSeconds(), m.riseTimeSeconds(), m.overshootPercent()));
    }
}
