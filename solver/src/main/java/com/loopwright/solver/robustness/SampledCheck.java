package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;

/**
 * The loop run by a sampled controller at Ts: the continuous gains emulated, the direct discrete design, and
 * optionally the longest Ts that meets the limits.
 */
final class SampledCheck {

    private final DelayedSampledStepSimulator sampled;
    private final DiscretePoleMatching discrete = new DiscretePoleMatching();
    private final LongestSamplePeriodSearch longest;

    SampledCheck(DelayedSampledStepSimulator sampled) {
        this.sampled = sampled;
        this.longest = new LongestSamplePeriodSearch(sampled);
    }

    SampledReport run(
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            double ts,
            AcceptanceLimits limits,
            boolean searchLongestPeriod,
            double horizonSeconds) {
        double radius = spectralRadius(plant, gains, ts);
        DenseTrajectory emulated = null;
        GridMetrics emulatedMetrics = null;
        try {
            emulated = sampled.simulate(plant, gains, stepSize, ts, 0, horizonSeconds);
            emulatedMetrics = RobustnessVerifier.metricsOf(emulated, plant, gains, stepSize, limits);
        } catch (IllegalArgumentException e) {
            emulated = null; // overflow: the sampled loop diverges (see the spectral radius)
        }
        FeedbackGains directGains = null;
        GridMetrics directMetrics = null;
        try {
            directGains = discrete.design(plant, gains, ts);
            directMetrics = RobustnessVerifier.metricsOf(
                    sampled.simulate(plant, directGains, stepSize, ts, 0, horizonSeconds),
                    plant,
                    directGains,
                    stepSize,
                    limits);
        } catch (IllegalArgumentException e) {
            directMetrics = null; // the direct design overflowed: it cannot be used at this Ts
        }
        LongestSamplePeriod search = searchLongestPeriod && limits.judges()
                ? longest.search(plant, gains, stepSize, limits, horizonSeconds)
                : LongestSamplePeriod.NOT_SEARCHED;
        return new SampledReport(
                ts,
                radius,
                emulatedMetrics,
                Verdict.ofStep(limits, emulatedMetrics),
                directGains,
                directMetrics,
                Verdict.ofStep(limits, directMetrics),
                search.periodSeconds().isPresent() ? search.periodSeconds().getAsDouble() : null,
                search.lowerBoundOnly(),
                search.evaluations(),
                emulated);
    }

    /** max |z| over the eigenvalues of Ad - Bd K, the emulated sampled loop without delay. */
    static double spectralRadius(CanonicalPlant plant, FeedbackGains gains, double ts) {
        try {
            DiscreteStateSpace hold =
                    ZeroOrderHold.discretize(LoopMatrices.openLoop(plant), LoopMatrices.actuatorInput(plant), ts);
            DMatrixRMaj closed = hold.ad();
            DMatrixRMaj bd = hold.bd();
            for (int i = 0; i < 2; i++) {
                closed.add(i, 0, -bd.get(i, 0) * gains.positionGain());
                closed.add(i, 1, -bd.get(i, 0) * gains.velocityGain());
            }
            double radius = 0;
            for (Complex_F64 z : LoopMatrices.poles(closed)) {
                radius = Math.max(radius, z.getMagnitude());
            }
            return radius;
        } catch (IllegalArgumentException e) {
            return Double.MAX_VALUE; // e^(A Ts) overflows: the open loop grows beyond double precision in one period
        }
    }
}
