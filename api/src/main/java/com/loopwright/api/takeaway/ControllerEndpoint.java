package com.loopwright.api.takeaway;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.design.ValidatedDesign;
import com.loopwright.api.endpoint.Attachment;
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
import com.loopwright.solver.pipeline.ControllerOptions;
import com.loopwright.solver.pipeline.ControllerTexts;
import com.loopwright.solver.pipeline.DesignPipeline;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.ExportPipeline;
import com.loopwright.solver.pipeline.ExportProvenance;
import com.loopwright.solver.pipeline.LoopExport;
import com.loopwright.solver.pipeline.RealLoopPipeline;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.TwoStateModel;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.ejml.data.DMatrixRMaj;

/**
 * POST /v1/designs/controllers/{format}, one format: the design, its emulated sampled law checked at the task
 * period and the sampled loop's step from the solver, written as IEC 61131-3 Structured Text, a C header or source,
 * a PLCopen XML project or a JSON parameter set, each an attachment named after the prefix. Stateless.
 */
final class ControllerEndpoint implements Endpoint<ControllerRequest, ControllerEndpoint.Validated, ControllerExport> {

    private static final String TITLE = "Loopwright state-feedback controller (generated; review before use)";
    private static final String DOUBLE = "double";
    private static final String SINGLE = "single";
    private static final String EMULATION = "emulation";
    private static final String ZERO_ORDER_HOLD = "zeroOrderHold";

    private final ControllerFormat format;
    private final TakeawayDesign designRequests = new TakeawayDesign();
    private final DesignPipeline designs = new DesignPipeline(FieldLimits.SPEC_RANGES);
    private final ExportPipeline exports = new ExportPipeline();
    private final RealLoopPipeline realLoops = new RealLoopPipeline();

    record Validated(ValidatedDesign design, ControllerOptions options) {}

    ControllerEndpoint(ControllerFormat format) {
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
                    List.of(new FieldError("", "a JSON object with design, samplePeriod and actuatorLimit")));
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
        double[] range = commandRange(request, errors);
        OperatingPoint point = request.operatingPoint();
        double output = 0;
        double command = 0;
        if (point != null) {
            output = bounded(errors, "/operatingPoint/output", point.output(), TakeawayLimits.MAX_OPERATING_OUTPUT);
            command = bounded(errors, "/operatingPoint/command", point.command(), TakeawayLimits.MAX_ACTUATOR_RANGE);
            if (range != null && point.command() != null && !(command >= range[0] && command <= range[1])) {
                errors.add(new FieldError(
                        "/operatingPoint/command",
                        "the command at the operating point must lie within the actuator's range " + range[0] + " to "
                                + range[1]));
            }
        }
        String prefix = request.prefix() == null ? TakeawayLimits.DEFAULT_PREFIX : request.prefix();
        ControllerOptions.prefixProblem(prefix).ifPresent(why -> errors.add(new FieldError("/prefix", why)));
        String precision = request.precision() == null ? DOUBLE : request.precision();
        if (!precision.equals(DOUBLE) && !precision.equals(SINGLE)) {
            errors.add(new FieldError("/precision", "must be \"double\" (LREAL/double) or \"single\" (REAL/float)"));
        }
        Double tolerance = request.periodTolerancePercent();
        if (tolerance != null && !(tolerance > 0 && tolerance <= TakeawayLimits.MAX_PERIOD_TOLERANCE_PERCENT)) {
            errors.add(new FieldError(
                    "/periodTolerancePercent",
                    "must be a finite number above 0 and at most " + TakeawayLimits.MAX_PERIOD_TOLERANCE_PERCENT));
        }
        ValidatedDesign design = designRequests.validate(request.design(), errors);
        return new Validated(
                design,
                new ControllerOptions(
                        period,
                        range[0],
                        range[1],
                        output,
                        command,
                        (tolerance == null ? TakeawayLimits.DEFAULT_PERIOD_TOLERANCE_PERCENT : tolerance) / 100,
                        prefix,
                        precision.equals(SINGLE)));
    }

    /** [lowest, highest] from exactly one of actuatorLimit and actuatorRange, or null after an error. */
    private static double[] commandRange(ControllerRequest request, List<FieldError> errors) {
        Double limit = request.actuatorLimit();
        ActuatorRange range = request.actuatorRange();
        if (limit != null && range != null) {
            errors.add(new FieldError(
                    "/actuatorRange",
                    "give either actuatorLimit (symmetric, -limit to limit) or actuatorRange (lowest to highest),"
                            + " not both"));
            return null;
        }
        if (limit == null && range == null) {
            errors.add(new FieldError(
                    "/actuatorLimit", "required: actuatorLimit, or actuatorRange for a range not symmetric about 0"));
            return null;
        }
        if (limit != null) {
            int before = errors.size();
            TakeawayDesign.optionalPositive(errors, "/actuatorLimit", limit, TakeawayLimits.MAX_ACTUATOR_LIMIT);
            return errors.size() == before ? new double[] {-limit, limit} : null;
        }
        int before = errors.size();
        double lowest = required(errors, "/actuatorRange/lowest", range.lowest());
        double highest = required(errors, "/actuatorRange/highest", range.highest());
        if (errors.size() > before) {
            return null;
        }
        if (!(lowest < highest)) {
            errors.add(new FieldError("/actuatorRange/highest", "must be above lowest (" + lowest + ")"));
            return null;
        }
        return new double[] {lowest, highest};
    }

    private static double required(List<FieldError> errors, String pointer, Double value) {
        if (value == null) {
            errors.add(new FieldError(pointer, "required"));
            return 0;
        }
        return bounded(errors, pointer, value, TakeawayLimits.MAX_ACTUATOR_RANGE);
    }

    /** The value, or 0 when absent; an error when it is not finite within [-max, max]. */
    private static double bounded(List<FieldError> errors, String pointer, Double value, double max) {
        if (value == null) {
            return 0;
        }
        if (!(value >= -max && value <= max)) {
            errors.add(new FieldError(pointer, "must be a finite number from " + -max + " to " + max));
            return 0;
        }
        return value;
    }

    @Override
    public ControllerExport compute(Validated validated) {
        ValidatedDesign design = validated.design();
        // the loop that runs first: an infeasible augmented design is named with its own proposal
        RealLoopReport loop = design.loop() == null
                ? null
                : realLoops.design(RealLoopPipeline.Request.canonical(
                        design.plant(),
                        design.spec(),
                        design.gammaChoice(),
                        design.loop().structure(),
                        design.loop().loadStepSize()));
        DesignReport report = designs.design(
                design.plant(), design.spec(), design.gammaChoice(), design.stepSize(), design.bandFraction());
        return loop == null
                ? exports.export(report, validated.options())
                : exports.export(report, loop, validated.options());
    }

    @Override
    public Object respond(Validated validated, ControllerExport export) {
        throw new UnsupportedOperationException("an exported controller states its trace: respond with the trace");
    }

    /** The code's header states the service version and the request digest first; the parameter set its trace. */
    @Override
    public Object respond(Validated validated, ControllerExport export, Trace trace) {
        String prefix = validated.options().prefix();
        if (format == ControllerFormat.PARAMETERS) {
            return new Attachment(prefix + "_parameters.json", parameters(export));
        }
        ControllerTexts texts = exports.texts(export, provenance(validated, export, trace));
        return switch (format) {
            case STRUCTURED_TEXT ->
                new Attachment(texts.structuredTextFileName(), new Text(format.mediaType(), texts.structuredText()));
            case C_HEADER -> new Attachment(texts.cHeaderFileName(), new Text(format.mediaType(), texts.cHeader()));
            case C_SOURCE -> new Attachment(texts.cSourceFileName(), new Text(format.mediaType(), texts.cSource()));
            case PLCOPEN_XML ->
                new Attachment(texts.plcOpenXmlFileName(), new Text(format.mediaType(), texts.plcOpenXml()));
            case PARAMETERS -> throw new IllegalStateException("answered above");
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
        return export.loop().map(loop -> loopParameters(export, loop)).orElseGet(() -> plainParameters(export));
    }

    private static ControllerParameters plainParameters(ControllerExport export) {
        DesignReport report = export.design();
        SampledLaw law = export.law();
        StepMetrics continuous = report.stepMetrics();
        return new ControllerParameters(
                "u = clamp(command + g*v, lowest, highest) with v = kr*(r - output) - (k1*(x1 - output) + k2*x2),"
                        + " (output, command) the operating point, (lowest, highest) the actuator range and g the"
                        + " code's gain scale (1 at full gain); evaluated once per sample period and held until the"
                        + " next; u = 0 while disabled",
                EMULATION,
                law.samplePeriod(),
                law.positionGain(),
                law.velocityGain(),
                law.referenceGain(),
                null,
                null,
                new ActuatorRange(law.commandMin(), law.commandMax()),
                operatingPoint(export),
                100 * export.options().periodToleranceFraction(),
                law.sampledSpectralRadius(),
                law.periodPerTimeConstant(),
                report.design().gamma(),
                metrics(continuous),
                export.sampledStep()
                        .map(m -> new RobustnessResponse.Metrics(
                                m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(), m.peakControl()))
                        .orElse(null),
                Cautions.ALL);
    }

    /** The loop with integral action and/or an observer: its gains, the exact discretization, its own step. */
    private static ControllerParameters loopParameters(ControllerExport export, LoopExport loop) {
        SampledLaw law = export.law();
        RealLoopReport report = loop.report();
        double[] k = report.law().stateGain();
        StepMetrics running = report.outputFeedback() == null
                ? report.stateFeedbackStep()
                : report.outputFeedback().step();
        return new ControllerParameters(
                "u = clamp(command + g*v, lowest, highest) with v = kr*(r - output) - (k1*xh1 + k2*xh2) + ki*xi,"
                        + " xi the integral of r - x1 (held while disabled or when it would drive the clamp further),"
                        + " (xh1, xh2) the measured state or, with position-only sensing, the observer's estimate"
                        + " (observer driven by the applied command); the controller's states discretized exactly"
                        + " for the sample period (zero-order hold); u = 0 while disabled",
                ZERO_ORDER_HOLD,
                law.samplePeriod(),
                k[0],
                k[1],
                report.law().referenceGain(),
                report.law().integralAction() ? report.law().integralGain() : null,
                report.observer() == null
                        ? null
                        : Arrays.stream(report.observer().gain()).boxed().toList(),
                new ActuatorRange(law.commandMin(), law.commandMax()),
                operatingPoint(export),
                100 * export.options().periodToleranceFraction(),
                loop.sampledSpectralRadius(),
                law.periodPerTimeConstant(),
                report.design().gamma(),
                metrics(running),
                null,
                Cautions.ALL);
    }

    private static OperatingPoint operatingPoint(ControllerExport export) {
        return new OperatingPoint(
                export.options().outputBias(), export.options().commandBias());
    }

    private static RobustnessResponse.Metrics metrics(StepMetrics m) {
        return new RobustnessResponse.Metrics(
                m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(), m.peakControl());
    }

    /**
     * The header: the build and request, the plant, the specs, the target, the continuous and sampled step, the
     * sampled loop's check, the cautions (the pipeline adds gamma and the design period).
     */
    private static ExportProvenance provenance(Validated validated, ControllerExport export, Trace trace) {
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
        // a loop export quotes the step of the loop that runs (with its observer); the plain law's sampled step
        // belongs to the plain law only
        StepMetrics running = export.loop()
                .map(loop -> loop.report().outputFeedback() == null
                        ? loop.report().stateFeedbackStep()
                        : loop.report().outputFeedback().step())
                .orElse(metrics);
        List<String> specs = new ArrayList<>();
        if (validated.design().resolvedPlant().source() instanceof TwoStateModel model) {
            specs.add(callerCoordinatesLine(model));
        }
        specs.add(String.format(
                Locale.ROOT,
                "Specs: %s, overshoot %.6g%%",
                time,
                100 * report.spec().overshootFraction()));
        specs.add(String.format(
                Locale.ROOT,
                "Target: damping ratio %.6g, natural frequency %.6g rad/s",
                target.dampingRatio(),
                target.naturalFrequencyRadPerSec()));
        specs.add(String.format(
                Locale.ROOT,
                "Simulated (continuous, unclamped): rise %.5g s, settling %.5g s, overshoot %.5g%%, peak |u| %.5g",
                running.riseTimeSeconds(),
                running.settlingTimeSeconds(),
                running.overshootPercent(),
                running.peakControl()));
        if (export.loop().isPresent()) {
            specs.add(loopLine(export.loop().get()));
        } else {
            specs.add(sampledStep
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
                            + " short to simulate over the horizon)"));
            specs.add(String.format(
                    Locale.ROOT,
                    "Sampled loop (emulation, gains unchanged): spectral radius %s, wn T = %s",
                    law.sampledSpectralRadius(),
                    law.periodPerTimeConstant()));
        }
        specs.add("Certified: " + report.verification().certified());
        return new ExportProvenance(
                TITLE,
                trace == null ? "unknown" : trace.serviceVersion(),
                trace == null ? "none" : trace.requestDigest(),
                "x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w with a0 = " + p.a0() + ", a1 = " + p.a1() + ", b = " + p.b()
                        + ", d = " + p.d(),
                specs,
                Cautions.ALL);
    }

    /**
     * A state-space plant: the block's inputs are the canonical states z = T^-1 x, not the caller's x (z1 the tracked
     * output, z2 its derivative); the design response's model.stateSpace states the gains on x.
     */
    private static String callerCoordinatesLine(TwoStateModel model) {
        DMatrixRMaj tInv = model.inverseTransform();
        return String.format(
                Locale.ROOT,
                "State-space plant: the inputs are the canonical states z = T^-1 x of your model, not your x:"
                        + " Y1 = z1 = %.6g x1 + (%.6g) x2 (the tracked output), Y2 = z2 = dz1/dt = %.6g x1 + (%.6g) x2"
                        + " (T^-1 = [[%.6g, %.6g], [%.6g, %.6g]]); the design response's model.stateSpace gives the"
                        + " gains on your x",
                tInv.get(0, 0),
                tInv.get(0, 1),
                tInv.get(1, 0),
                tInv.get(1, 1),
                tInv.get(0, 0),
                tInv.get(0, 1),
                tInv.get(1, 0),
                tInv.get(1, 1));
    }

    /** The exported loop in one line: integrator, observer, the exact discretization and its check. */
    private static String loopLine(LoopExport loop) {
        RealLoopReport report = loop.report();
        List<String> parts = new ArrayList<>();
        if (report.law().integralAction()) {
            parts.add(String.format(
                    Locale.ROOT,
                    "integral action (ki = %s, integral pole %.6g rad/s)",
                    report.law().integralGain(),
                    report.law().integralPoleRadPerSec()));
        }
        if (report.observer() != null) {
            parts.add("position-only sensing with an observer (L = "
                    + Arrays.toString(report.observer().gain()) + ", gamma "
                    + report.design().gamma() + " certifies the state-feedback loop)");
        }
        return "Loop: " + String.join(", ", parts) + "; k = "
                + Arrays.toString(report.law().stateGain())
                + ", kr = " + report.law().referenceGain()
                + "; discretized exactly for T (zero-order hold); sampled loop spectral radius "
                + loop.sampledSpectralRadius();
    }

    private static String seconds(Double value) {
        return value == null ? "not reached" : String.format(Locale.ROOT, "%.5g s", value);
    }
}
