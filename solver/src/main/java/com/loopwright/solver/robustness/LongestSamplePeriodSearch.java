package com.loopwright.solver.robustness;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import java.util.OptionalDouble;

/**
 * The longest sample period at which the emulated gains still meet the acceptance limits: doubling or halving from
 * pi / max|lambda| to a bracket [meeting, failing], then bisection to {@value #SEARCH_RELATIVE_WIDTH} relative width.
 * Assumes the limits hold for all Ts below the first failing one that the bracket finds.
 */
final class LongestSamplePeriodSearch {

    /** Search caps: doublings, halvings and bisections of the sample period. */
    static final int MAX_DOUBLINGS = 6;

    static final int MAX_HALVINGS = 12;
    static final int MAX_BISECTIONS = 20;
    static final double SEARCH_RELATIVE_WIDTH = 1e-3;

    private final DelayedSampledStepSimulator sampled;

    LongestSamplePeriodSearch(DelayedSampledStepSimulator sampled) {
        this.sampled = sampled;
    }

    LongestSamplePeriod search(
            CanonicalPlant plant, FeedbackGains gains, double stepSize, AcceptanceLimits limits, double horizon) {
        int[] evaluations = {0};
        double start = Math.PI / LoopMatrices.fastestPoleMagnitude(plant, gains);
        double lo;
        double hi;
        if (meets(plant, gains, stepSize, limits, horizon, start, evaluations)) {
            lo = start;
            hi = Double.NaN;
            for (int i = 0; i < MAX_DOUBLINGS; i++) {
                double next = 2 * lo;
                if (meets(plant, gains, stepSize, limits, horizon, next, evaluations)) {
                    lo = next;
                } else {
                    hi = next;
                    break;
                }
            }
            if (Double.isNaN(hi)) {
                return new LongestSamplePeriod(OptionalDouble.of(lo), true, evaluations[0]);
            }
        } else {
            hi = start;
            lo = Double.NaN;
            for (int i = 0; i < MAX_HALVINGS; i++) {
                double next = hi / 2;
                if (meets(plant, gains, stepSize, limits, horizon, next, evaluations)) {
                    lo = next;
                    break;
                }
                hi = next;
            }
            if (Double.isNaN(lo)) {
                return new LongestSamplePeriod(OptionalDouble.empty(), false, evaluations[0]);
            }
        }
        for (int i = 0; i < MAX_BISECTIONS && hi - lo > SEARCH_RELATIVE_WIDTH * lo; i++) {
            double mid = 0.5 * (lo + hi);
            if (meets(plant, gains, stepSize, limits, horizon, mid, evaluations)) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return new LongestSamplePeriod(OptionalDouble.of(lo), false, evaluations[0]);
    }

    private boolean meets(
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            AcceptanceLimits limits,
            double horizon,
            double ts,
            int[] evaluations) {
        Cancellation.checkpoint(); // one simulation of the longest-period search
        evaluations[0]++;
        if (Math.ceil(horizon / ts) > DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS) {
            return false;
        }
        try {
            GridMetrics metrics = RobustnessVerifier.metricsOf(
                    sampled.simulate(plant, gains, stepSize, ts, 0, horizon), plant, gains, stepSize, limits);
            return limits.met(metrics.settlingTimeSeconds(), metrics.riseTimeSeconds(), metrics.overshootPercent());
        } catch (IllegalArgumentException e) {
            return false;
        }
    }
}
