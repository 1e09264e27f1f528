package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.DiscreteControllers;
import com.loopwright.solver.export.BlockPrefix;
import com.loopwright.solver.export.ControllerCWriter;
import com.loopwright.solver.export.ControllerExportOptions;
import com.loopwright.solver.export.ControllerStructuredTextWriter;
import com.loopwright.solver.export.PlcOpenXmlWriter;
import com.loopwright.solver.export.Precision;
import com.loopwright.solver.export.ProvenanceHeader;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.export.SampledLawException;
import com.loopwright.solver.robustness.SampledStepMetrics;
import java.time.Instant;
import java.util.Optional;

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
        return new ControllerExport(report, law, sampledStep, options);
    }

    /**
     * The exported law as Structured Text, a C header and source pair and a PLCopen XML project under one
     * provenance header (the caller's, with the design's gamma and period): u = clamp(u0 + g v, uMin, uMax) with
     * v = kr (r - y0) - (k1 (x1 - y0) + k2 x2), gain scale g, bumpless enable, status and period check.
     *
     * @throws IllegalArgumentException when a constant cannot be written (non-finite, or beyond REAL's range)
     */
    public ControllerTexts texts(ControllerExport export, ExportProvenance provenance) {
        SampledLaw law = export.law();
        ControllerOptions o = export.options();
        DiscreteController controller = DiscreteControllers.fromStateFeedback(
                law.samplePeriod(), law.positionGain(), law.velocityGain(), law.referenceGain());
        // the velocity's operating point is 0: the bias of the second measured channel is 0
        ControllerSettings settings = new ControllerSettings(
                law.commandMin(),
                law.commandMax(),
                o.commandBias(),
                new double[] {o.outputBias(), 0},
                o.periodToleranceFraction());
        ProvenanceHeader header = new ProvenanceHeader(
                provenance.title(),
                provenance.serviceVersion(),
                provenance.requestDigest(),
                provenance.plant(),
                provenance.specLines(),
                export.design().design().gamma(),
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
