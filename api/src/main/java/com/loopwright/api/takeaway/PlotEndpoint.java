package com.loopwright.api.takeaway;

import com.loopwright.api.design.ValidatedDesign;
import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureContext;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.endpoint.Text;
import com.loopwright.api.plot.DesignFigures;
import com.loopwright.api.plot.Figure;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.robustness.ValidatedVerify;
import com.loopwright.api.robustness.VerifyInputValidator;
import com.loopwright.api.robustness.VerifyLimits;
import com.loopwright.api.validation.FieldLimits;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.solver.pipeline.BodeData;
import com.loopwright.solver.pipeline.DesignPipeline;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.FigurePipeline;
import com.loopwright.solver.pipeline.StepSeries;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.RobustnessOptions;
import com.loopwright.solver.robustness.StepEnvelope;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * POST /v1/designs/plots/{figure}, one figure: the design, the figure's data from the solver, drawn as SVG.
 * The uncertainty band takes its parameter box from design.verify.uncertainty (the ranges a robustness check
 * uses); up to {@link StepEnvelope#MAX_INTERIOR_SAMPLES} of its Monte Carlo samples are drawn. Stateless.
 */
final class PlotEndpoint implements Endpoint<PlotRequest, PlotEndpoint.Validated, PlotEndpoint.Result> {

    static final String SVG = "image/svg+xml";
    private static final String UNCERTAINTY_POINTER = TakeawayDesign.PREFIX + "/verify/uncertainty";

    private final Figure figure;
    private final TakeawayDesign designRequests = new TakeawayDesign();
    private final VerifyInputValidator verifyValidator = new VerifyInputValidator();
    private final DesignPipeline designs = new DesignPipeline(FieldLimits.SPEC_RANGES);
    private final FigurePipeline data = new FigurePipeline();
    private final DesignFigures figures = new DesignFigures();

    /**
     * @param actuatorLimit the actuator limit to draw, if given
     * @param verify       the band's parameter box and samples (uncertainty band only)
     * @param bandErrors   why the band cannot be drawn from this request; reported once the design is feasible
     */
    record Validated(
            ValidatedDesign design, OptionalDouble actuatorLimit, ValidatedVerify verify, List<FieldError> bandErrors) {
        Validated {
            bandErrors = List.copyOf(bandErrors);
        }
    }

    /** The design and the data of one figure (the fields the figure does not draw are null). */
    record Result(DesignReport report, StepSeries step, BodeData bode, StepEnvelope.Band band) {}

    PlotEndpoint(Figure figure) {
        this.figure = figure;
    }

    @Override
    public Class<PlotRequest> requestType() {
        return PlotRequest.class;
    }

    @Override
    public Validated validate(PlotRequest request) {
        if (request == null) {
            throw new InvalidRequestException(List.of(new FieldError("", "a JSON object with design")));
        }
        List<FieldError> errors = new ArrayList<>();
        TakeawayDesign.optionalPositive(
                errors, "/actuatorLimit", request.actuatorLimit(), TakeawayLimits.MAX_ACTUATOR_LIMIT);
        ValidatedDesign design = designRequests.validate(request.design(), errors);
        OptionalDouble limit =
                request.actuatorLimit() == null ? OptionalDouble.empty() : OptionalDouble.of(request.actuatorLimit());
        if (figure != Figure.UNCERTAINTY_BAND) {
            return new Validated(design, limit, null, List.of());
        }
        if (request.design().verify() == null || request.design().verify().uncertainty() == null) {
            return new Validated(
                    design,
                    limit,
                    null,
                    List.of(new FieldError(
                            UNCERTAINTY_POINTER,
                            "required for the uncertainty-band figure: the parameter ranges to sweep")));
        }
        List<FieldError> verifyErrors = new ArrayList<>();
        ValidatedVerify verify = verifyValidator.validate(
                request.design().verify(), design.plant(), TakeawayDesign.PREFIX + "/verify", verifyErrors);
        return new Validated(design, limit, verify, verify == null ? VerifyLimits.capped(verifyErrors) : List.of());
    }

    @Override
    public List<FieldError> deferredErrors(Validated validated) {
        return validated.bandErrors();
    }

    @Override
    public Result compute(Validated validated) {
        ValidatedDesign design = validated.design();
        DesignReport report = designs.design(
                design.plant(), design.spec(), design.gammaChoice(), design.stepSize(), design.bandFraction());
        if (!validated.bandErrors().isEmpty()) {
            throw new InvalidRequestException(validated.bandErrors());
        }
        return switch (figure) {
            case STEP_RESPONSE, CONTROL_EFFORT -> new Result(report, data.step(report), null, null);
            case BODE -> new Result(report, null, data.bode(report), null);
            case UNCERTAINTY_BAND -> {
                RobustnessOptions options = validated.verify().options();
                yield new Result(
                        report,
                        null,
                        null,
                        data.band(report, options.parameterBox(), options.monteCarloSamples(), options.seed()));
            }
        };
    }

    @Override
    public Object respond(Validated validated, Result result) {
        DesignReport report = result.report();
        String svg = switch (figure) {
            case STEP_RESPONSE -> figures.stepResponse(report, result.step());
            case CONTROL_EFFORT -> figures.controlEffort(report, result.step(), validated.actuatorLimit());
            case BODE -> figures.bode(report, result.bode());
            case UNCERTAINTY_BAND ->
                figures.uncertaintyBand(
                        report,
                        result.band(),
                        ranges(validated.verify().options().parameterBox()));
        };
        return new Text(SVG, svg);
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable("the figure's " + pointer + " is outside double precision");
    }

    @Override
    public Problem unwritable(IllegalArgumentException failure) {
        return FailureTable.unverifiable("the figure could not be drawn: " + failure.getMessage());
    }

    @Override
    public FailureContext failureContext(Validated validated) {
        return TakeawayDesign.context(validated == null ? null : validated.design());
    }

    private static String ranges(ParameterBox box) {
        return String.format(
                Locale.ROOT,
                "a0 %s, a1 %s, b %s, d %s",
                range(box.a0Min(), box.a0Max()),
                range(box.a1Min(), box.a1Max()),
                range(box.bMin(), box.bMax()),
                range(box.dMin(), box.dMax()));
    }

    private static String range(double low, double high) {
        return low == high
                ? String.format(Locale.ROOT, "%.4g", low)
                : String.format(Locale.ROOT, "%.4g..%.4g", low, high);
    }
}
