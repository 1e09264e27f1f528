package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;

/** The reference step with an input delay, simulated exactly in the sampled loop, and the delay margin. */
final class DelayCheck {

    private final DelayedSampledStepSimulator sampled;

    DelayCheck(DelayedSampledStepSimulator sampled) {
        this.sampled = sampled;
    }

    /**
     * @param ts                 sample period of the simulation (the requested Ts, or a fine period)
     * @param delayMarginSeconds the continuous loop's delay margin, null without a crossover
     * @param horizonSeconds     the simulated window, the slow horizon plus the delay
     */
    DelayReport run(
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            double delay,
            double ts,
            Double delayMarginSeconds,
            AcceptanceLimits limits,
            double horizonSeconds) {
        DenseTrajectory trajectory = null;
        GridMetrics metrics = null;
        boolean diverges = false;
        try {
            trajectory = sampled.simulate(plant, gains, stepSize, ts, delay, horizonSeconds);
            metrics = RobustnessVerifier.metricsOf(trajectory, plant, gains, stepSize, limits);
        } catch (IllegalArgumentException e) {
            diverges = true;
        }
        Verdict withinMargin = delayMarginSeconds == null ? Verdict.NOT_JUDGED : Verdict.of(delay < delayMarginSeconds);
        return new DelayReport(
                delay,
                ts,
                delayMarginSeconds,
                withinMargin,
                diverges,
                metrics,
                Verdict.ofStep(limits, metrics),
                trajectory);
    }
}
