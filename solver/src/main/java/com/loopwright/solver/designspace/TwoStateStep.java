package com.loopwright.solver.designspace;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.TwoStateStepMetrics;

/**
 * The step figures a map judges a case by, from the exact two-state step metrics without a simulation
 * ({@link TwoStateStepMetrics}, the same figures the uncertainty analysis of a design reports).
 *
 * @param stable           c0 = a0 + b k1 &gt; 0 and c1 = a1 + b k2 &gt; 0
 * @param timeSeconds      settling (or rise) time, null when unstable or not measurable in double precision
 * @param overshootPercent overshoot [%], null when unstable or not measurable
 * @param peakControl      peak |u| of the step, null when unstable or not measurable
 */
record TwoStateStep(boolean stable, Double timeSeconds, Double overshootPercent, Double peakControl) {

    static final TwoStateStep UNSTABLE = new TwoStateStep(false, null, null, null);
    static final TwoStateStep UNMEASURED = new TwoStateStep(true, null, null, null);

    /**
     * @param settling true: the settling time to the band; false: the 10-90% rise time
     * @param stepSize the reference step
     */
    static TwoStateStep of(
            CanonicalPlant plant, FeedbackGains gains, boolean settling, double bandFraction, double stepSize) {
        double c0 = plant.a0() + plant.b() * gains.positionGain();
        double c1 = plant.a1() + plant.b() * gains.velocityGain();
        if (!(c0 > 0 && c1 > 0) || !Double.isFinite(c0) || !Double.isFinite(c1)) {
            return UNSTABLE;
        }
        StepMetrics metrics;
        try {
            metrics = TwoStateStepMetrics.measure(plant, gains, stepSize, bandFraction);
        } catch (IllegalArgumentException e) {
            return UNMEASURED; // a damping ratio too small for the root finder, or no final value
        }
        return new TwoStateStep(
                true,
                settling ? metrics.settlingTimeSeconds() : metrics.riseTimeSeconds(),
                metrics.overshootPercent(),
                metrics.peakControl());
    }
}
