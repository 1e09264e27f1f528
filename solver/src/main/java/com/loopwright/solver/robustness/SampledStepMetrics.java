package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import java.util.Optional;

/**
 * Step metrics of the loop run by a sampled controller with the continuous gains (emulation, zero-order hold, no
 * clamp): the continuous plant is propagated exactly between samples and observed at and between the sample
 * instants, over the slow horizon of {@link RobustnessVerifier} ({@value RobustnessVerifier#SLOW_HORIZON_FACTOR}
 * nominal horizons). The same numbers as the emulated section of a verification at that sample period.
 * Stateless and thread-safe.
 */
public final class SampledStepMetrics {

    private final DelayedSampledStepSimulator simulator = new DelayedSampledStepSimulator();

    /**
     * @param bandFraction settling band as a fraction of the final value
     * @return the metrics, or empty when the nominal loop is unstable, the sampled loop diverges, or the horizon
     *     needs more than the simulator's cap of sample intervals (a period that short behaves as the continuous loop)
     */
    public Optional<GridMetrics> measure(
            CanonicalPlant plant, FeedbackGains gains, double stepSize, double samplePeriod, double bandFraction) {
        return trajectory(plant, gains, stepSize, samplePeriod)
                .map(t -> GridMetrics.of(t, LoopMatrices.unitStepFinalValue(plant, gains) * stepSize, bandFraction));
    }

    /**
     * The sampled step itself (x1 observed at and between the samples, the held command) over the slow horizon, or
     * empty in the cases {@link #measure} lists.
     */
    public Optional<DenseTrajectory> trajectory(
            CanonicalPlant plant, FeedbackGains gains, double stepSize, double samplePeriod) {
        if (!LoopMatrices.stable(plant, gains)) {
            return Optional.empty();
        }
        double horizon = horizonSeconds(plant, gains);
        if (!(Math.ceil(horizon / samplePeriod) <= DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS)) {
            return Optional.empty();
        }
        try {
            return Optional.of(simulator.simulate(plant, gains, stepSize, samplePeriod, 0, horizon));
        } catch (IllegalArgumentException e) {
            return Optional.empty(); // the state overflowed: the sampled loop diverges
        }
    }

    /** The slow horizon the sampled step is observed over [s]: that of a verification (stable loop only). */
    public static double horizonSeconds(CanonicalPlant plant, FeedbackGains gains) {
        return RobustnessVerifier.SLOW_HORIZON_FACTOR * LoopMatrices.horizonSeconds(plant, gains);
    }
}
