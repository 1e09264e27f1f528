package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.export.CSourceWriter;
import com.loopwright.solver.export.ControllerCWriter;
import com.loopwright.solver.export.ControllerExportOptions;
import com.loopwright.solver.export.ControllerStructuredTextWriter;
import com.loopwright.solver.export.ControllerTexts;
import com.loopwright.solver.export.ExportHeader;
import com.loopwright.solver.export.PlcOpenXmlWriter;
import com.loopwright.solver.export.ProvenanceHeader;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.export.SampledLawException;
import com.loopwright.solver.export.StructuredTextWriter;
import com.loopwright.solver.robustness.SampledStepMetrics;
import java.time.Instant;
import java.util.List;
import java.util.Optional;

/**
 * The front door of the controller export: the emulated sampled law of a verified design and the step of the
 * sampled loop it makes. Every failure is a {@link SolverFailure}. Stateless and thread-safe.
 */
public final class ExportPipeline {

    /** The shortest sample period a law is built for. */
    public static final double MIN_SAMPLE_PERIOD = SampledLawDesigner.MIN_SAMPLE_PERIOD;
    /** The longest sample period a law is built for. */
    public static final double MAX_SAMPLE_PERIOD = SampledLawDesigner.MAX_SAMPLE_PERIOD;

    private final SampledLawDesigner lawDesigner = new SampledLawDesigner();
    private final SampledStepMetrics sampledMetrics = new SampledStepMetrics();

    /**
     * @throws SolverFailure SAMPLED_LAW_INFEASIBLE with subject {@link SolverFailure#SAMPLE_PERIOD} or
     *                       {@link SolverFailure#ACTUATOR_LIMIT}
     */
    public ControllerExport export(DesignReport report, double samplePeriod, double actuatorLimit) {
        SampledLaw law;
        try {
            law = lawDesigner.emulate(report.design(), samplePeriod, actuatorLimit);
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
        return new ControllerExport(report, law, sampledStep);
    }

    /**
     * The law as an IEC 61131-3 Structured Text function block, under a comment header.
     *
     * @param specLines the header's lines (plant, specs, simulated steps), written as given
     * @throws IllegalArgumentException when a number cannot be written as source
     */
    public String structuredText(ControllerExport export, String title, List<String> specLines, List<String> cautions) {
        return new StructuredTextWriter().write(header(export, title, specLines, cautions), export.law());
    }

    /**
     * The law as a C function, under a comment header.
     *
     * @throws IllegalArgumentException when a number cannot be written as source
     */
    public String cSource(ControllerExport export, String title, List<String> specLines, List<String> cautions) {
        return new CSourceWriter().write(header(export, title, specLines, cautions), export.law());
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
        return new ControllerTexts(
                new ControllerStructuredTextWriter().write(header, controller, options),
                c.headerFileName(),
                c.header(),
                c.sourceFileName(),
                c.source(),
                new PlcOpenXmlWriter().write(header, controller, options, createdAt));
    }

    private static ExportHeader header(
            ControllerExport export, String title, List<String> specLines, List<String> cautions) {
        return new ExportHeader(title, specLines, export.design().design().gamma(), cautions);
    }
}
