package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.robustness.SampledStepMetrics;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Predicate;
import org.ejml.data.DMatrixRMaj;

/**
 * The case judge of a robust design of the full-state loop run by the exported sampled law: the law the controller
 * exports emit ({@link SampledLawDesigner#emulate}), the continuous gains k1, k2, kr of the nominal target used
 * unchanged once per period T, u[k] = kr r - (k1 x1[k] + k2 x2[k]) held until the next sample. A target is a design
 * only where that law is exported: wn T &lt;= {@value SampledLawDesigner#MAX_PERIOD_PER_TIME_CONSTANT} and the
 * closed-form design exists. A case (the perturbed plant sampled exactly under zero-order hold,
 * x[k+1] = Ad x[k] + Bd u[k]) fails when the spectral radius of Ad - Bd K is 1 or more; else its step is that of a
 * verification's emulated sampled section ({@link SampledStepMetrics}: x1 observed at and between the samples over
 * the slow horizon).
 */
final class SampledLawJudge implements SimulatedTargetSearch.CaseJudge<FeedbackGains> {

    /** The ceiling is kept this fraction below 0.5 / T so that wn T &lt;= 0.5 holds in floating point there. */
    private static final double CEILING_ROOM = 1e-9;

    private final CanonicalPlant nominal;
    private final List<CanonicalPlant> everyCase;
    private final double samplePeriod;
    private final double stepSize;
    private final double bandFraction;
    private final Predicate<TargetDynamics> designable;
    private final SampledStepMetrics sampled = new SampledStepMetrics();

    /**
     * @param everyCase  the corners, then the samples
     * @param designable whether the closed-form design exists at a target
     */
    SampledLawJudge(
            CanonicalPlant nominal,
            List<CanonicalPlant> everyCase,
            double samplePeriod,
            double stepSize,
            double bandFraction,
            Predicate<TargetDynamics> designable) {
        this.nominal = nominal;
        this.everyCase = List.copyOf(everyCase);
        this.samplePeriod = samplePeriod;
        this.stepSize = stepSize;
        this.bandFraction = bandFraction;
        this.designable = designable;
    }

    /** The largest natural frequency whose law is exported at period T: wn T &lt;= 0.5 [rad/s]. */
    static double frequencyCeiling(double samplePeriod) {
        return SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT / samplePeriod * (1 - CEILING_ROOM);
    }

    @Override
    public FeedbackGains designAt(TargetDynamics target) {
        if (samplePeriod > SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT / target.naturalFrequencyRadPerSec()) {
            return null; // the export refuses this law (wn T above 0.5)
        }
        return designable.test(target) ? RobustTargetSearch.gains(nominal, target) : null;
    }

    @Override
    public StepMetrics metrics(FeedbackGains gains, int index) {
        return metrics(gains, everyCase.get(index));
    }

    /**
     * The sampled step metrics of the law on one plant, or null when its sampled loop is not stable (spectral radius
     * at least 1, or the continuous loop unstable: no horizon) or the step does not settle within the horizon.
     *
     * @throws SamplePeriodException when the horizon needs more sample intervals than the simulator's cap
     */
    StepMetrics metrics(FeedbackGains gains, CanonicalPlant plant) {
        Cancellation.checkpoint();
        if (!(spectralRadius(plant, gains, samplePeriod) < 1) || !LoopMatrices.stable(plant, gains)) {
            return null;
        }
        double horizon = SampledStepMetrics.horizonSeconds(plant, gains);
        if (!(Math.ceil(horizon / samplePeriod) <= DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS)) {
            throw new SamplePeriodException(String.format(
                    Locale.ROOT,
                    "the sample period %.6g s is too short to simulate the sampled loop: its step horizon of %.6g s"
                            + " needs more than %d sample periods; at this period the loop behaves as the continuous"
                            + " loop (omit samplePeriod, or give the task's period if it is longer)",
                    samplePeriod,
                    horizon,
                    DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS));
        }
        Optional<DenseTrajectory> trajectory = sampled.trajectory(plant, gains, stepSize, samplePeriod);
        if (trajectory.isEmpty()) {
            return null;
        }
        return SampledCaseMetrics.of(
                trajectory.get(), LoopMatrices.unitStepFinalValue(plant, gains) * stepSize, stepSize, bandFraction);
    }

    /** One case for the report: its sampled step metrics (the corner norms are the continuous loop's, apart). */
    UncertainCase judged(FeedbackGains gains, CanonicalPlant plant, boolean corner, AcceptanceLimits limits) {
        return SampledCaseMetrics.judged(plant, corner, metrics(gains, plant), null, limits);
    }

    /** max |z| over the eigenvalues of Ad - Bd K, the emulated sampled loop (as the export checks it). */
    static double spectralRadius(CanonicalPlant plant, FeedbackGains gains, double samplePeriod) {
        try {
            DiscreteStateSpace hold = SampledLawDesigner.sampledPlant(plant, samplePeriod);
            DMatrixRMaj ad = hold.ad();
            DMatrixRMaj bd = hold.bd();
            double k1 = gains.positionGain();
            double k2 = gains.velocityGain();
            return SampledLawDesigner.spectralRadius(
                    ad.get(0, 0) - bd.get(0, 0) * k1,
                    ad.get(0, 1) - bd.get(0, 0) * k2,
                    ad.get(1, 0) - bd.get(1, 0) * k1,
                    ad.get(1, 1) - bd.get(1, 0) * k2);
        } catch (IllegalArgumentException e) {
            return Double.POSITIVE_INFINITY; // e^(A T) overflows: the open loop outgrows double precision in one period
        }
    }
}
