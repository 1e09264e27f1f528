package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.discrete.ContinuousControllerDesign;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.DiscreteControllers;
import com.loopwright.solver.discrete.SampledControllerStep;
import com.loopwright.solver.discrete.SampledLoopSpectrum;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * The case judge of a robust design of the loop with integral action and/or position-only sensing run by the
 * exported controller at period T: the loop designed for the nominal plant at the target ({@link RobustLoopSearch}),
 * discretized exactly as the loop exports do ({@link DiscreteControllers#fromContinuous}: zero-order hold with every
 * controller input held). A target is a design only where the export builds it: wn T &lt;=
 * {@value SampledLawDesigner#MAX_PERIOD_PER_TIME_CONSTANT}, the plain emulated law's sampled loop stable, and the
 * nominal sampled loop's spectral radius below {@value ExportPipeline#MAX_LOOP_SPECTRAL_RADIUS}. A case (the
 * perturbed plant sampled under zero-order hold, the controller unchanged) fails when its sampled loop's spectral
 * radius is {@value ExportPipeline#MAX_LOOP_SPECTRAL_RADIUS} or more; else its step is simulated with x1 observed at
 * and between the samples ({@link SampledControllerStep}) over max(3 settling limits, 14 / sigma), sigma =
 * -ln(radius) / T the slowest sampled decay rate (the horizon rule of the continuous loop search).
 */
final class SampledLoopJudge implements SimulatedTargetSearch.CaseJudge<SampledLoopJudge.Design> {

    /** A loop at one target: its continuous parts and the discrete controller the export emits. */
    record Design(RealLoopPipeline.LoopParts parts, DiscreteController controller) {}

    private final RobustLoopSearch<CanonicalPlant> loops;
    private final CanonicalPlant nominal;
    private final double samplePeriod;
    private final double stepSize;
    private final AcceptanceLimits limits;
    private final boolean observer;
    private final SampledControllerStep step = new SampledControllerStep();

    /**
     * @param loops    the continuous loop search of the same request (its designs, cases and corner norms)
     * @param observer position-only sensing (the controller measures x1 only)
     */
    SampledLoopJudge(
            RobustLoopSearch<CanonicalPlant> loops,
            CanonicalPlant nominal,
            double samplePeriod,
            double stepSize,
            AcceptanceLimits limits,
            boolean observer) {
        if (limits.settlingTimeSeconds() == null) {
            throw new IllegalArgumentException("this loop is judged against a settling-time limit");
        }
        this.loops = loops;
        this.nominal = nominal;
        this.samplePeriod = samplePeriod;
        this.stepSize = stepSize;
        this.limits = limits;
        this.observer = observer;
    }

    @Override
    public Design designAt(TargetDynamics target) {
        if (samplePeriod > SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT / target.naturalFrequencyRadPerSec()) {
            return null; // the export refuses this period (wn T above 0.5)
        }
        if (!(SampledLawJudge.spectralRadius(nominal, RobustTargetSearch.gains(nominal, target), samplePeriod) < 1)) {
            return null; // the export checks the plain emulated law first
        }
        RealLoopPipeline.LoopParts parts = loops.designAt(target);
        if (parts == null) {
            return null;
        }
        try {
            DiscreteController controller = controller(parts);
            double radius = SampledLoopSpectrum.spectralRadius(controller, a(nominal), b2(nominal), measured())
                    .orElse(Double.POSITIVE_INFINITY);
            return radius < ExportPipeline.MAX_LOOP_SPECTRAL_RADIUS ? new Design(parts, controller) : null;
        } catch (IllegalArgumentException e) {
            return null; // the block exponential overflowed: no controller at this period
        }
    }

    @Override
    public StepMetrics metrics(Design design, int index) {
        return metrics(design, loops.everyCase().get(index));
    }

    /**
     * The sampled step metrics of the controller on one plant, or null when the sampled loop's spectral radius is
     * {@value ExportPipeline#MAX_LOOP_SPECTRAL_RADIUS} or more or the step does not settle within the horizon.
     *
     * @throws SamplePeriodException when the horizon needs more sample intervals than the simulator's cap
     */
    StepMetrics metrics(Design design, CanonicalPlant plant) {
        Cancellation.checkpoint();
        double[][] a = a(plant);
        double[] b2 = b2(plant);
        double radius;
        try {
            radius = SampledLoopSpectrum.spectralRadius(design.controller(), a, b2, measured())
                    .orElse(Double.POSITIVE_INFINITY);
        } catch (IllegalArgumentException e) {
            return null; // e^(A T) overflows on this plant
        }
        if (!(radius < ExportPipeline.MAX_LOOP_SPECTRAL_RADIUS)) {
            return null;
        }
        double decayPerSecond = -Math.log(radius) / samplePeriod;
        double horizon = Math.max(
                RealLoopPipeline.HORIZON_SETTLING_TIMES * limits.settlingTimeSeconds(),
                RealLoopPipeline.HORIZON_TIME_CONSTANTS / decayPerSecond);
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
        try {
            DenseTrajectory trajectory = step.simulate(design.controller(), a, b2, measured(), stepSize, horizon);
            double finalValue = step.finalValue(design.controller(), a, b2, measured(), stepSize);
            return SampledCaseMetrics.of(trajectory, finalValue, stepSize, limits.bandFraction());
        } catch (IllegalArgumentException e) {
            return null; // the state overflowed or the loop has no steady state
        }
    }

    /** One case for the report: its sampled step, and at a corner the continuous loop's norm from w to z. */
    UncertainCase judged(Design design, CanonicalPlant plant, boolean corner) {
        Double norm = corner ? loops.cornerNorm(design.parts(), plant) : null;
        return SampledCaseMetrics.judged(plant, corner, metrics(design, plant), norm, limits);
    }

    /** The loop's controller as the export builds it (ExportPipeline: the same continuous design, the same call). */
    private DiscreteController controller(RealLoopPipeline.LoopParts parts) {
        TrackingLaw law = parts.law();
        double[][] observerGain = new double[2][observer ? 1 : 0];
        if (observer) {
            observerGain[0][0] = parts.observerGain()[0];
            observerGain[1][0] = parts.observerGain()[1];
        }
        return DiscreteControllers.fromContinuous(
                samplePeriod,
                new ContinuousControllerDesign(
                        a(nominal),
                        b2(nominal),
                        measured(),
                        law.stateGain(),
                        law.integralAction() ? OptionalDouble.of(law.integralGain()) : OptionalDouble.empty(),
                        observerGain,
                        law.referenceGain()));
    }

    private double[][] measured() {
        return observer ? new double[][] {{1, 0}} : new double[][] {{1, 0}, {0, 1}};
    }

    private static double[][] a(CanonicalPlant plant) {
        return new double[][] {{0, 1}, {-plant.a0(), -plant.a1()}};
    }

    private static double[] b2(CanonicalPlant plant) {
        return new double[] {0, plant.b()};
    }

    /** The cases, the corners first. */
    List<CanonicalPlant> everyCase() {
        return loops.everyCase();
    }
}
