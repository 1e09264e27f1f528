package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.discrete.ContinuousControllerDesign;
import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.DiscreteControllers;
import com.loopwright.solver.discrete.SampledLoopSpectrum;
import com.loopwright.solver.export.BlockPrefix;
import com.loopwright.solver.export.ControllerCWriter;
import com.loopwright.solver.export.ControllerExportOptions;
import com.loopwright.solver.export.ControllerStructuredTextWriter;
import com.loopwright.solver.export.PlcOpenXmlWriter;
import com.loopwright.solver.export.Precision;
import com.loopwright.solver.export.ProvenanceHeader;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.export.SampledLawException;
import com.loopwright.solver.numeric.SafeRounding;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.SampledStepMetrics;
import java.time.Instant;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The front door of the controller export: the emulated sampled law of a verified design, the step of the
 * sampled loop it makes, and the law as Structured Text, C and PLCopen XML. Every failure of the law is a
 * {@link SolverFailure}. Stateless and thread-safe.
 */
public final class ExportPipeline {

    /** The shortest sample period a law is built for. */
    public static final double MIN_SAMPLE_PERIOD = SampledLawDesigner.MIN_SAMPLE_PERIOD;
    /** The longest sample period a law is built for. */
    public static final double MAX_SAMPLE_PERIOD = SampledLawDesigner.MAX_SAMPLE_PERIOD;

    /**
     * The PLCopen fileHeader creationDateTime of every export: fixed, so one request always gives the same bytes
     * (the request digest in the header says which design it is).
     */
    public static final Instant PLCOPEN_CREATED = Instant.parse("2000-01-01T00:00:00Z");

    /**
     * A loop with an integrator or observer is exported only when its sampled loop's spectral radius is below this:
     * a pole within 0.001 of the unit circle decays by less than 0.1 % per sample, too slow to trust under rounding
     * and jitter (common practice: keep sampled poles off the unit circle with a margin).
     */
    public static final double MAX_LOOP_SPECTRAL_RADIUS = 0.999;

    private final SampledLawDesigner lawDesigner = new SampledLawDesigner();
    private final SampledStepMetrics sampledMetrics = new SampledStepMetrics();

    /**
     * The sampled law at the options' period and command range, checked (wn T and the spectral radius of the
     * sampled loop), and the sampled loop's own step.
     *
     * @throws SolverFailure SAMPLED_LAW_INFEASIBLE with subject {@link SolverFailure#SAMPLE_PERIOD} or
     *                       {@link SolverFailure#ACTUATOR_LIMIT}
     */
    public ControllerExport export(DesignReport report, ControllerOptions options) {
        SampledLaw law;
        try {
            law = lawDesigner.emulate(
                    report.design(), options.samplePeriod(), options.commandMin(), options.commandMax());
        } catch (SampledLawException e) {
            throw SolverFailure.about(
                    SolverFailure.Kind.SAMPLED_LAW_INFEASIBLE,
                    e.aboutSamplePeriod() ? SolverFailure.SAMPLE_PERIOD : SolverFailure.ACTUATOR_LIMIT,
                    -1,
                    e.getMessage(),
                    e);
        }
        ClosedFormDesign d = report.design();
        // the sampled loop's own step (not the continuous one): the header and the parameter set quote both
        Optional<GridMetrics> sampledStep = sampledMetrics.measure(
                d.plant(),
                new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain()),
                report.stepSize(),
                law.samplePeriod(),
                report.bandFraction());
        return new ControllerExport(report, law, sampledStep, options, Optional.empty());
    }

    /**
     * The loop with integral action and/or an observer, discretized exactly for the options' period (zero-order
     * hold with every controller input held: {@link DiscreteControllers#fromContinuous}), and checked: wn T at
     * most {@value SampledLawDesigner#MAX_PERIOD_PER_TIME_CONSTANT} (as for the plain law) and the spectral radius of
     * the sampled loop (plant and controller, unclamped) below {@value #MAX_LOOP_SPECTRAL_RADIUS}.
     *
     * @param report the plain design of the same request (its emulated law is checked first, and its step quoted)
     * @param loop   the loop design ({@link RealLoopPipeline}) of the canonical plant
     * @throws SolverFailure SAMPLED_LAW_INFEASIBLE with subject {@link SolverFailure#SAMPLE_PERIOD}
     */
    public ControllerExport export(DesignReport report, RealLoopReport loop, ControllerOptions options) {
        ControllerExport plain = export(report, options);
        CanonicalPlant plant = report.design().plant();
        double[][] a = {{0, 1}, {-plant.a0(), -plant.a1()}};
        double[] b2 = {0, plant.b()};
        boolean observer = loop.observer() != null;
        double[][] measured = observer ? new double[][] {{1, 0}} : new double[][] {{1, 0}, {0, 1}};
        double[][] observerGain = new double[2][observer ? 1 : 0];
        if (observer) {
            double[] l = loop.observer().gain();
            observerGain[0][0] = l[0];
            observerGain[1][0] = l[1];
        }
        TrackingLaw law = loop.law();
        DiscreteController controller = DiscreteControllers.fromContinuous(
                options.samplePeriod(),
                new ContinuousControllerDesign(
                        a,
                        b2,
                        measured,
                        law.stateGain(),
                        law.integralAction() ? OptionalDouble.of(law.integralGain()) : OptionalDouble.empty(),
                        observerGain,
                        law.referenceGain()));
        double radius =
                SampledLoopSpectrum.spectralRadius(controller, a, b2, measured).orElse(Double.POSITIVE_INFINITY);
        if (!(radius < MAX_LOOP_SPECTRAL_RADIUS)) {
            String what = observer && law.integralAction()
                    ? "integral action and the observer"
                    : observer ? "the observer" : "integral action";
            // the slowest continuous pole maps to e^(-zeta wn T): below 0.999 only when zeta wn T > 0.001
            double decayPerSecond = loop.target().dampingRatio() * loop.target().naturalFrequencyRadPerSec();
            String advice = radius < 1
                    ? String.format(
                            Locale.ROOT,
                            "its slowest mode decays by less than 0.1 %% per sample; lengthen the period above %.4g s"
                                    + " (0.001 / (zeta wn)) or ask for a faster loop",
                            SafeRounding.atLeast(-Math.log(MAX_LOOP_SPECTRAL_RADIUS) / decayPerSecond, 4))
                    : "it is unstable; shorten the sample period";
            throw SolverFailure.about(
                    SolverFailure.Kind.SAMPLED_LAW_INFEASIBLE,
                    SolverFailure.SAMPLE_PERIOD,
                    -1,
                    String.format(
                            Locale.ROOT,
                            "the sampled loop with %s has spectral radius %.6g, not below %s: %s",
                            what,
                            radius,
                            MAX_LOOP_SPECTRAL_RADIUS,
                            advice),
                    null);
        }
        return new ControllerExport(
                report,
                plain.law(),
                plain.sampledStep(),
                options,
                Optional.of(new LoopExport(loop, controller, radius)));
    }

    /**
     * The exported controller as Structured Text, a C header and source pair and a PLCopen XML project under one
     * provenance header (the caller's, with the design's gamma and period): the plain law u = clamp(u0 + g v, uMin,
     * uMax) with v = kr (r - y0) - (k1 (x1 - y0) + k2 x2), or the loop's controller (integrator with anti-windup,
     * observer); gain scale g, bumpless enable, status and period check.
     *
     * @throws IllegalArgumentException when a constant cannot be written (non-finite, or beyond REAL's range)
     */
    public ControllerTexts texts(ControllerExport export, ExportProvenance provenance) {
        SampledLaw law = export.law();
        ControllerOptions o = export.options();
        DiscreteController controller = export.loop()
                .map(LoopExport::controller)
                .orElseGet(() -> DiscreteControllers.fromStateFeedback(
                        law.samplePeriod(), law.positionGain(), law.velocityGain(), law.referenceGain()));
        // the velocity's operating point is 0: the bias of a second measured channel is 0
        double[] measurementBias = new double[controller.measuredCount()];
        measurementBias[0] = o.outputBias();
        ControllerSettings settings = new ControllerSettings(
                law.commandMin(), law.commandMax(), o.commandBias(), measurementBias, o.periodToleranceFraction());
        ProvenanceHeader header = new ProvenanceHeader(
                provenance.title(),
                provenance.serviceVersion(),
                provenance.requestDigest(),
                provenance.plant(),
                provenance.specLines(),
                export.loop()
                        .map(loop -> loop.report().design().gamma())
                        .orElse(export.design().design().gamma()),
                provenance.cautions());
        return controllerTexts(
                controller,
                header,
                new ControllerExportOptions(
                        new BlockPrefix(o.prefix()),
                        o.singlePrecision() ? Precision.SINGLE : Precision.DOUBLE,
                        settings),
                PLCOPEN_CREATED);
    }

    /**
     * A generic discrete controller (plain law, integral action, observer) as Structured Text, a C header and
     * source pair and a PLCopen XML project, all with the same provenance header, prefix and precision.
     *
     * @param createdAt the PLCopen fileHeader creationDateTime (fixed instant: reproducible bytes)
     * @throws IllegalArgumentException when a constant cannot be written (non-finite, or beyond REAL's range) or
     *     the settings do not match the controller's measured channels
     */
    public ControllerTexts controllerTexts(
            DiscreteController controller,
            ProvenanceHeader header,
            ControllerExportOptions options,
            Instant createdAt) {
        ControllerCWriter.Pair c = new ControllerCWriter().write(header, controller, options);
        String block = options.prefix().blockName();
        return new ControllerTexts(
                block + ".st",
                new ControllerStructuredTextWriter().write(header, controller, options),
                c.headerFileName(),
                c.header(),
                c.sourceFileName(),
                c.source(),
                block + ".xml",
                new PlcOpenXmlWriter().write(header, controller, options, createdAt));
    }
}
