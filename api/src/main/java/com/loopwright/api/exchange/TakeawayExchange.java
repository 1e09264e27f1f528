package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.mapping.Cautions;
import com.loopwright.api.mapping.ProblemMapper;
import com.loopwright.api.plot.DesignFigures;
import com.loopwright.api.plot.Figure;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.problem.Proposal;
import com.loopwright.api.request.ControllerRequest;
import com.loopwright.api.request.DesignRequestValidator;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.api.request.PlotRequest;
import com.loopwright.api.request.TakeawayLimits;
import com.loopwright.api.request.ValidatedDesign;
import com.loopwright.api.response.ControllerParameters;
import com.loopwright.api.response.RobustnessResponse;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.export.CSourceWriter;
import com.loopwright.solver.export.ExportHeader;
import com.loopwright.solver.export.SampledLaw;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.export.SampledLawException;
import com.loopwright.solver.export.StructuredTextWriter;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.spec.TimeSpec;
import com.loopwright.solver.verify.VerificationFailedException;
import com.loopwright.api.request.ValidatedVerify;
import com.loopwright.api.request.VerifyInputValidator;
import com.loopwright.api.request.VerifyLimits;
import com.loopwright.solver.plant.PlantParameterException;
import com.loopwright.solver.loop.FeedbackGains;
import com.loopwright.solver.simulation.GridMetrics;
import com.loopwright.solver.robustness.SampledStepMetrics;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.RobustnessOptions;
import com.loopwright.solver.robustness.StepEnvelope;
import com.loopwright.solver.robustness.UnstableLoopException;
import com.loopwright.solver.design.ClosedFormDesign;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * What people take away from a design: SVG figures and controller code. Each request carries the design request
 * under "design" (pointers of its problems are prefixed with /design). Stateless and thread-safe.
 */
public final class TakeawayExchange {

    public static final String SVG = "image/svg+xml";
    public static final String STRUCTURED_TEXT = "text/plain; charset=utf-8";
    public static final String C_SOURCE = "text/x-c; charset=utf-8";
    public static final String JSON = "application/json";

    /** Controller formats: the path segment of POST /v1/designs/controllers/{format}. */
    public static final List<String> FORMATS = List.of("structured-text", "c", "parameters");

    private final ObjectMapper mapper;
    private final DesignRequestValidator validator = new DesignRequestValidator();
    private final LoopDesigner designer = new LoopDesigner(com.loopwright.api.request.FieldLimits.SPEC_RANGES);
    private final ProblemMapper problems = new ProblemMapper();
    private final DesignFigures figures = new DesignFigures();
    private final SampledLawDesigner lawDesigner = new SampledLawDesigner();
    private final VerifyInputValidator verifyValidator = new VerifyInputValidator();
    private final StepEnvelope envelope = new StepEnvelope();
    private final SampledStepMetrics sampledMetrics = new SampledStepMetrics();

    public TakeawayExchange(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    public Takeaway plot(String figureSlug, byte[] body) {
        Figure figure = Figure.ofSlug(figureSlug).orElse(null);
        if (figure == null) {
            return failure(ProblemType.NOT_FOUND.problem("no figure '" + figureSlug + "'; figures are"
                    + " step-response, control-effort, bode and uncertainty-band"));
        }
        PlotRequest request;
        try {
            request = mapper.readValue(body, PlotRequest.class);
        } catch (JsonProcessingException e) {
            return failure(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return failure(DecodeFailures.unreadable());
        }
        if (request == null) {
            return failure(invalid(List.of(new FieldError("", "a JSON object with design"))));
        }
        List<FieldError> errors = new ArrayList<>();
        optionalPositive(errors, "/commandLimit", request.commandLimit(), TakeawayLimits.MAX_COMMAND_LIMIT);
        Designed designed = design(request.design(), errors);
        if (designed.problem() != null) {
            return failure(designed.problem());
        }
        OptionalDouble limit = request.commandLimit() == null ? OptionalDouble.empty()
                : OptionalDouble.of(request.commandLimit());
        try {
            if (figure == Figure.UNCERTAINTY_BAND) {
                return uncertaintyBand(request, designed);
            }
            return new Takeaway(200, SVG, figures.draw(figure, designed.report(), limit), null);
        } catch (IllegalArgumentException e) {
            return failure(problems.unverifiable("the figure could not be drawn: " + e.getMessage()));
        }
    }

    /**
     * The uncertainty band takes its parameter box from design.verify.uncertainty (the same ranges a
     * robustness check uses); up to {@link StepEnvelope#MAX_INTERIOR_SAMPLES} of its Monte Carlo samples are drawn.
     */
    private Takeaway uncertaintyBand(PlotRequest request, Designed designed) {
        String pointer = "/design/verify/uncertainty";
        if (request.design().verify() == null || request.design().verify().uncertainty() == null) {
            return failure(invalid(List.of(new FieldError(pointer,
                    "required for the uncertainty-band figure: the parameter ranges to sweep"))));
        }
        List<FieldError> errors = new ArrayList<>();
        ValidatedVerify verify = verifyValidator.validate(request.design().verify(), designed.validated().plant(),
                "/design/verify", errors);
        if (verify == null) {
            return failure(invalid(VerifyLimits.capped(errors)));
        }
        RobustnessOptions options = verify.options();
        ClosedFormDesign d = designed.report().design();
        ParameterBox box = options.parameterBox();
        int interior = Math.min(options.monteCarloSamples(), StepEnvelope.MAX_INTERIOR_SAMPLES);
        try {
            StepEnvelope.Band band = envelope.sweep(box, d.plant(),
                    new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain()),
                    designed.report().stepSize(), designed.report().horizonSeconds(), DesignFigures.PLOT_SAMPLES,
                    interior, options.seed());
            String ranges = String.format(Locale.ROOT, "a0 %s, a1 %s, b %s, d %s", range(box.a0Min(), box.a0Max()),
                    range(box.a1Min(), box.a1Max()), range(box.bMin(), box.bMax()), range(box.dMin(), box.dMax()));
            return new Takeaway(200, SVG, figures.uncertaintyBand(designed.report(), band, ranges), null);
        } catch (UnstableLoopException e) {
            return failure(ProblemType.UNSTABLE_LOOP.problem(e.getMessage(),
                    List.of(new FieldError(pointer, e.getMessage())), List.of()));
        }
    }

    private static String range(double low, double high) {
        return low == high ? String.format(Locale.ROOT, "%.4g", low)
                : String.format(Locale.ROOT, "%.4g..%.4g", low, high);
    }

    public Takeaway controller(String format, byte[] body) {
        if (!FORMATS.contains(format)) {
            return failure(ProblemType.NOT_FOUND.problem("no controller format '" + format + "'; formats are "
                    + String.join(", ", FORMATS)));
        }
        ControllerRequest request;
        try {
            request = mapper.readValue(body, ControllerRequest.class);
        } catch (JsonProcessingException e) {
            return failure(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return failure(DecodeFailures.unreadable());
        }
        if (request == null) {
            return failure(invalid(List.of(new FieldError("", "a JSON object with design, samplePeriodSeconds"
                    + " and commandLimit"))));
        }
        List<FieldError> errors = new ArrayList<>();
        Double period = request.samplePeriodSeconds();
        if (period == null) {
            errors.add(new FieldError("/samplePeriodSeconds", "required"));
        } else if (!(period >= TakeawayLimits.MIN_SAMPLE_PERIOD_SECONDS
                && period <= TakeawayLimits.MAX_SAMPLE_PERIOD_SECONDS)) {
            errors.add(new FieldError("/samplePeriodSeconds", "must be a finite number from "
                    + TakeawayLimits.MIN_SAMPLE_PERIOD_SECONDS + " to " + TakeawayLimits.MAX_SAMPLE_PERIOD_SECONDS));
        }
        if (request.commandLimit() == null) {
            errors.add(new FieldError("/commandLimit", "required"));
        } else {
            optionalPositive(errors, "/commandLimit", request.commandLimit(), TakeawayLimits.MAX_COMMAND_LIMIT);
        }
        Designed designed = design(request.design(), errors);
        if (designed.problem() != null) {
            return failure(designed.problem());
        }
        DesignReport report = designed.report();
        SampledLaw law;
        try {
            law = lawDesigner.emulate(report.design(), period, request.commandLimit());
        } catch (SampledLawException e) {
            String pointer = e.aboutSamplePeriod() ? "/samplePeriodSeconds" : "/commandLimit";
            return failure(ProblemType.INFEASIBLE_SPEC.problem(e.getMessage(),
                    List.of(new FieldError(pointer, e.getMessage())), List.of()));
        }
        ClosedFormDesign d = report.design();
        // the sampled loop's own step (not the continuous one): the header and the parameter set quote both
        Optional<GridMetrics> sampledStep = sampledMetrics.measure(d.plant(),
                new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain()), report.stepSize(),
                law.samplePeriodSeconds(), report.bandFraction());
        ExportHeader header = header(designed.validated(), report, law, sampledStep);
        try {
            return switch (format) {
                case "structured-text" -> new Takeaway(200, STRUCTURED_TEXT,
                        new StructuredTextWriter().write(header, law), null);
                case "c" -> new Takeaway(200, C_SOURCE, new CSourceWriter().write(header, law), null);
                default -> parameters(report, law, sampledStep);
            };
        } catch (IllegalArgumentException e) {
            return failure(problems.unverifiable("the controller could not be written: " + e.getMessage()));
        }
    }

    private Takeaway parameters(DesignReport report, SampledLaw law, Optional<GridMetrics> sampledStep) {
        var continuous = report.verification().metrics();
        ControllerParameters parameters = new ControllerParameters(
                "u = clamp(kr*r - (k1*x1 + k2*x2), -commandLimit, commandLimit), evaluated once per sample period"
                        + " and held until the next", "emulation", law.samplePeriodSeconds(), law.positionGain(),
                law.velocityGain(), law.referenceGain(), law.commandLimit(), law.sampledSpectralRadius(),
                law.periodPerTimeConstant(), report.design().gamma(),
                new RobustnessResponse.Metrics(continuous.riseTimeSeconds(), continuous.settlingTimeSeconds(),
                        continuous.overshootPercent(), continuous.peakControl()),
                sampledStep.map(m -> new RobustnessResponse.Metrics(m.riseTimeSeconds(), m.settlingTimeSeconds(),
                        m.overshootPercent(), m.peakControl())).orElse(null), Cautions.ALL);
        var tree = mapper.valueToTree(parameters);
        String nonFinite = FiniteNumbers.firstNonFinite((com.fasterxml.jackson.databind.JsonNode) tree);
        if (nonFinite != null) {
            return failure(problems.unverifiable("the controller's " + nonFinite + " is outside double precision"));
        }
        try {
            return new Takeaway(200, JSON, mapper.writeValueAsString(tree), null);
        } catch (JsonProcessingException e) {
            return failure(ProblemType.INTERNAL_ERROR.problem(null));
        }
    }

    private static ExportHeader header(ValidatedDesign validated, DesignReport report, SampledLaw law,
                                       Optional<GridMetrics> sampledStep) {
        var p = validated.plant();
        var target = report.design().target();
        var metrics = report.verification().metrics();
        String time = report.spec().timeSpec() instanceof TimeSpec.SettlingTime s
                ? String.format(Locale.ROOT, "settling time %.6g s (%.3g%% band)", s.seconds(), 100 * s.bandFraction())
                : String.format(Locale.ROOT, "rise time (10-90%%) %.6g s",
                        ((TimeSpec.RiseTime) report.spec().timeSpec()).seconds());
        List<String> lines = List.of(
                "Plant: x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w with a0 = " + p.a0() + ", a1 = " + p.a1()
                        + ", b = " + p.b() + ", d = " + p.d(),
                String.format(Locale.ROOT, "Specs: %s, overshoot %.6g%%", time, 100 * report.spec().overshootFraction()),
                String.format(Locale.ROOT, "Target: damping ratio %.6g, natural frequency %.6g rad/s",
                        target.dampingRatio(), target.naturalFrequencyRadPerSec()),
                String.format(Locale.ROOT, "Simulated (continuous, unclamped): rise %.5g s, settling %.5g s,"
                        + " overshoot %.5g%%, peak |u| %.5g", metrics.riseTimeSeconds(), metrics.settlingTimeSeconds(),
                        metrics.overshootPercent(), metrics.peakControl()),
                sampledStep.map(m -> String.format(Locale.ROOT, "Simulated (sampled at T = %s s, zero-order hold,"
                        + " unclamped, between samples): rise %s, settling %s, overshoot %.5g%%, peak |u| %.5g",
                        law.samplePeriodSeconds(), seconds(m.riseTimeSeconds()), seconds(m.settlingTimeSeconds()),
                        m.overshootPercent(), m.peakControl()))
                        .orElse("Simulated (sampled): not simulated (the sampled loop diverges or the period is too"
                                + " short to simulate over the horizon)"),
                "Certified: " + report.verification().certified());
        return new ExportHeader("Loopwright state-feedback controller (generated; review before use)", lines,
                report.design().gamma(), Cautions.ALL);
    }

    private static String seconds(Double value) {
        return value == null ? "not reached" : String.format(Locale.ROOT, "%.5g s", value);
    }

    private record Designed(ValidatedDesign validated, DesignReport report, Problem problem) {
    }

    /** Validates and designs; field errors of the wrapper are reported together with the design's. */
    private Designed design(com.loopwright.api.request.DesignRequest request, List<FieldError> wrapperErrors) {
        ValidatedDesign validated = null;
        List<FieldError> errors = new ArrayList<>(wrapperErrors);
        if (request == null) {
            errors.add(new FieldError("/design", "required: the design request as POST /v1/designs takes it"));
        } else {
            try {
                validated = validator.validate(request);
            } catch (InvalidRequestException e) {
                e.errors().forEach(f -> errors.add(new FieldError("/design" + f.pointer(), f.detail())));
            } catch (PlantParameterException e) {
                return new Designed(null, null, plantProblem(e));
            }
        }
        if (!errors.isEmpty()) {
            return new Designed(null, null, invalid(errors));
        }
        try {
            DesignReport report = designer.design(validated.plant(), validated.spec(), validated.gammaChoice(),
                    validated.stepSize(), validated.bandFraction());
            return new Designed(validated, report, null);
        } catch (InfeasibleDesignException e) {
            return new Designed(null, null, prefixed(problems.infeasible(e.infeasibility(),
                    validated.timeSpecPointer())));
        } catch (VerificationFailedException e) {
            return new Designed(null, null, problems.unverifiable(e.getMessage()));
        }
    }

    private Problem plantProblem(PlantParameterException e) {
        return prefixed(problems.plantModel(e));
    }

    private Problem invalid(List<FieldError> errors) {
        return problems.invalid(new InvalidRequestException(errors));
    }

    private static Problem prefixed(Problem p) {
        return new Problem(p.type(), p.title(), p.status(), p.detail(), p.instance(),
                p.errors().stream().map(f -> new FieldError("/design" + f.pointer(), f.detail())).toList(),
                p.proposals().stream().map(x -> new Proposal("/design" + x.pointer(), x.value(), x.note())).toList());
    }

    private static void optionalPositive(List<FieldError> errors, String pointer, Double value, double max) {
        if (value != null && !(value > 0 && value <= max)) {
            errors.add(new FieldError(pointer, "must be a finite number above 0 and at most " + max));
        }
    }

    private Takeaway failure(Problem problem) {
        try {
            return new Takeaway(problem.status(), Problem.MEDIA_TYPE, mapper.writeValueAsString(problem), problem);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }
}
