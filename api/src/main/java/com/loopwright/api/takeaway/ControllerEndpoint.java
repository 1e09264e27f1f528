package com.loopwright.api.takeaway;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.design.ValidatedDesign;
import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureContext;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.endpoint.Text;
import com.loopwright.api.endpoint.Trace;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.robustness.RobustnessResponse;
import com.loopwright.api.validation.FieldLimits;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.pipeline.ControllerExport;
import com.loopwright.solver.pipeline.DesignPipeline;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.ExportPipeline;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * POST /v1/designs/controllers/{format}, one format: the design, its emulated sampled law and the sampled loop's
 * step from the solver, written as IEC 61131-3 Structured Text, C, or a JSON parameter set. Stateless.
 */
final class ControllerEndpoint implements Endpoint<ControllerRequest, ControllerEndpoint.Validated, ControllerExport> {

    static final String STRUCTURED_TEXT = "text/plain; charset=utf-8";
    static final String C_SOURCE = "text/x-c; charset=utf-8";
    private static final String TITLE = "Loopwright state-feedback controller (generated; review before use)";

    private final String format;
    private final TakeawayDesign designRequests = new TakeawayDesign();
    private final DesignPipeline designs = new DesignPipeline(FieldLimits.SPEC_RANGES);
    private final ExportPipeline exports = new ExportPipeline();

    record Validated(ValidatedDesign design, double samplePeriod, double actuatorLimit) {}

    /** @param format one of {@link Takeaways#FORMATS} */
    ControllerEndpoint(String format) {
        this.format = format;
    }

    @Override
    public Class<ControllerRequest> requestType() {
        return ControllerRequest.class;
    }

    @Override
    public Validated validate(ControllerRequest request) {
        if (request == null) {
            throw new InvalidRequestException(
                    List.of(new FieldError("", "a JSON object with design," + " samplePeriod and actuatorLimit")));
        }
        List<FieldError> errors = new ArrayList<>();
        Double period = request.samplePeriod();
        if (period == null) {
            errors.add(new FieldError("/samplePeriod", "required"));
        } else if (!(period >= TakeawayLimits.MIN_SAMPLE_PERIOD && period <= TakeawayLimits.MAX_SAMPLE_PERIOD)) {
            errors.add(new FieldError(
                    "/samplePeriod",
                    "must be a finite number from " + TakeawayLimits.MIN_SAMPLE_PERIOD + " to "
                            + TakeawayLimits.MAX_SAMPLE_PERIOD));
        }
        if (request.actuatorLimit() == null) {
            errors.add(new FieldError("/actuatorLimit", "required"));
        } else {
            TakeawayDesign.optionalPositive(
                    errors, "/actuatorLimit", request.actuatorLimit(), TakeawayLimits.MAX_ACTUATOR_LIMIT);
        }
        ValidatedDesign design = designRequests.validate(request.design(), errors);
        return new Validated(design, period, request.actuatorLimit());
    }

    @Override
    public ControllerExport compute(Validated validated) {
        ValidatedDesign design = validated.design();
        DesignReport report = designs.design(
                design.plant(), design.spec(), design.gammaChoice(), design.stepSize(), design.bandFraction());
        return exports.export(report, validated.samplePeriod(), validated.actuatorLimit());
    }

    @Override
    public Object respond(Validated validated, ControllerExport export) {
        throw new UnsupportedOperationException("an exported controller states its trace: respond with the trace");
    }

    /** The code's header states the service version and the request digest first; the parameter set its trace. */
    @Override
    public Object respond(Validated validated, ControllerExport export, Trace trace) {
        return switch (format) {
            case "structured-text" ->
                new Text(
                        STRUCTURED_TEXT,
                        exports.structuredText(export, TITLE, headerLines(validated, export, trace), Cautions.ALL));
            case "c" ->
                new Text(C_SOURCE, exports.cSource(export, TITLE, headerLines(validated, export, trace), Cautions.ALL));
            default -> parameters(export);
        };
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable("the controller's " + pointer + " is outside double precision");
    }

    @Override
    public Problem unwritable(IllegalArgumentException failure) {
        return FailureTable.unverifiable("the controller could not be written: " + failure.getMessage());
    }

    @Override
    public FailureContext failureContext(Validated validated) {
        return TakeawayDesign.context(validated == null ? null : validated.design());
    }

    private static ControllerParameters parameters(ControllerExport export) {
        DesignReport report = export.design();
        SampledLaw law = export.law();
        StepMetrics continuous = report.stepMetrics();
        return new ControllerParameters(
                "u = clamp(kr*r - (k1*x1 + k2*x2), -actuatorLimit, actuatorLimit), evaluated once per sample period"
                        + " and held until the next",
                "emulation",
                law.samplePeriod(),
                law.positionGain(),
                law.velocityGain(),
                law.referenceGain(),
                law.actuatorLimit(),
                law.sampledSpectralRadius(),
                law.periodPerTimeConstant(),
                report.design().gamma(),
                new RobustnessResponse.Metrics(
                        continuous.riseTimeSeconds(),
                        continuous.settlingTimeSeconds(),
                        continuous.overshootPercent(),
                        continuous.peakControl()),
                export.sampledStep()
                        .map(m -> new RobustnessResponse.Metrics(
                                m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(), m.peakControl()))
                        .orElse(null),
                Cautions.ALL);
    }

    /** The header's lines: the build and request, the plant, the specs, the target, the continuous and sampled step. */
    private static List<String> headerLines(Validated validated, ControllerExport export, Trace trace) {
        DesignReport report = export.design();
        SampledLaw law = export.law();
        Optional<GridMetrics> sampledStep = export.sampledStep();
        CanonicalPlant p = validated.design().plant();
        TargetDynamics target = report.design().target();
        StepMetrics metrics = report.stepMetrics();
        String time = report.spec().timeSpec() instanceof TimeSpec.SettlingTime s
                ? String.format(Locale.ROOT, "settling time %.6g s (%.3g%% band)", s.seconds(), 100 * s.bandFraction())
                : String.format(
                        Locale.ROOT,
                        "rise time (10-90%%) %.6g s",
                        ((TimeSpec.RiseTime) report.spec().timeSpec()).seconds());
        List<String> lines = new ArrayList<>(trace == null ? List.of() : trace.headerLines());
        lines.addAll(List.of(
                "Plant: x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w with a0 = " + p.a0() + ", a1 = " + p.a1() + ", b = "
                        + p.b() + ", d = " + p.d(),
                String.format(
                        Locale.ROOT,
                        "Specs: %s, overshoot %.6g%%",
                        time,
                        100 * report.spec().overshootFraction()),
                String.format(
                        Locale.ROOT,
                        "Target: damping ratio %.6g, natural frequency %.6g rad/s",
                        target.dampingRatio(),
                        target.naturalFrequencyRadPerSec()),
                String.format(
                        Locale.ROOT,
                        "Simulated (continuous, unclamped): rise %.5g s, settling %.5g s,"
                                + " overshoot %.5g%%, peak |u| %.5g",
                        metrics.riseTimeSeconds(),
                        metrics.settlingTimeSeconds(),
                        metrics.overshootPercent(),
                        metrics.peakControl()),
                sampledStep
                        .map(m -> String.format(
                                Locale.ROOT,
                                "Simulated (sampled at T = %s s, zero-order hold,"
                                        + " unclamped, between samples): rise %s, settling %s, overshoot %.5g%%, peak |u| %.5g",
                                law.samplePeriod(),
                                seconds(m.riseTimeSeconds()),
                                seconds(m.settlingTimeSeconds()),
                                m.overshootPercent(),
                                m.peakControl()))
                        .orElse("Simulated (sampled): not simulated (the sampled loop diverges or the period is too"
                                + " short to simulate over the horizon)"),
                "Certified: " + report.verification().certified()));
        return lines;
    }

    private static String seconds(Double value) {
        return value == null ? "not reached" : String.format(Locale.ROOT, "%.5g s", value);
    }
}
