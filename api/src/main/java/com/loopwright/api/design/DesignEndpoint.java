package com.loopwright.api.design;

import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.FailureContext;
import com.loopwright.api.endpoint.FailureTable;
import com.loopwright.api.loop.LoopResponseMapper;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.robustness.RobustnessResponse;
import com.loopwright.api.robustness.RobustnessResponseMapper;
import com.loopwright.api.robustness.SamplingInput;
import com.loopwright.api.robustness.ValidatedVerify;
import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.robustness.VerifyInputValidator;
import com.loopwright.api.robustness.VerifyLimits;
import com.loopwright.api.validation.FieldLimits;
import com.loopwright.api.validation.InvalidRequestException;
import com.loopwright.api.validation.SpecInput;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.pipeline.DesignPipeline;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.RealLoopPipeline;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.pipeline.RobustDesignPipeline;
import com.loopwright.solver.pipeline.RobustDesignReport;
import com.loopwright.solver.pipeline.RobustnessPipeline;
import com.loopwright.solver.pipeline.StateSpaceDesign;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.RobustnessOptions;
import com.loopwright.solver.robustness.RobustnessReport;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;

/**
 * POST /v1/designs (and each batch item): the two-state design, its coordinates in the caller's state space, and
 * the robustness checks when the request asks for them. Stateless and thread-safe.
 */
public final class DesignEndpoint implements Endpoint<DesignRequest, DesignEndpoint.Validated, DesignEndpoint.Result> {

    /** The robustness section's performance output: a design always weights z = [rho1 x1, rho2 x2, u]. */
    private static final String WEIGHTED_OUTPUT = "z = [rho1 x1, rho2 x2, u]";

    private static final String VERIFY_POINTER = "/verify";

    private static final String ROBUST_POINTER = "/robust";

    /** The law's coordinates: the canonical states (model.units names their units). */
    private static final String CANONICAL_COORDINATES = "canonical x = [x1, x2] (see model.units)";

    /** A state-space plant: the law is stated in canonical coordinates here and in the caller's in the model. */
    private static final String CANONICAL_NOT_CALLER = "canonical z = [z1, z2] (x = T z, model.stateSpace.transform);"
            + " this law in your coordinates x is model.stateSpace.loopLaw";

    private final DesignRequestValidator validator = new DesignRequestValidator();
    private final VerifyInputValidator verifyValidator = new VerifyInputValidator();
    private final DesignPipeline designs = new DesignPipeline(FieldLimits.SPEC_RANGES);
    private final RobustnessPipeline robustness = new RobustnessPipeline();
    private final RobustDesignPipeline robustDesigns = new RobustDesignPipeline();
    private final RobustDesignMapper robustDesignResponses = new RobustDesignMapper();
    private final DesignResponseMapper responses = new DesignResponseMapper();
    private final RealLoopPipeline realLoops = new RealLoopPipeline();
    private final LoopResponseMapper loopResponses = new LoopResponseMapper();
    private final RobustnessResponseMapper robustnessResponses = new RobustnessResponseMapper();

    /**
     * @param design       the design request, validated
     * @param verify       the robustness checks, or null when not asked for (or invalid)
     * @param verifyErrors the field errors of the verify object; reported after the design is found feasible, as
     *                     the contract orders them (an infeasible spec is named first)
     * @param sentSpec     the spec object as sent (the proposals of an infeasible spec return it amended)
     */
    public record Validated(
            ValidatedDesign design,
            ValidatedVerify verify,
            List<FieldError> verifyErrors,
            SpecInput sentSpec,
            ValidatedVerify robust) {
        public Validated {
            verifyErrors = List.copyOf(verifyErrors);
        }

        public Validated(
                ValidatedDesign design, ValidatedVerify verify, List<FieldError> verifyErrors, SpecInput sentSpec) {
            this(design, verify, verifyErrors, sentSpec, null);
        }
    }

    /**
     * @param report            the design and its verification
     * @param callerCoordinates the design in the caller's state-space coordinates, or null
     * @param robustness        the robustness checks, or null
     * @param loop              the loop with integral action and/or an observer, or null when not asked for
     */
    public record Result(
            DesignReport report,
            StateSpaceDesign callerCoordinates,
            RobustnessReport robustness,
            RealLoopReport loop,
            RobustDesignReport robustDesign) {

        public Result(
                DesignReport report,
                StateSpaceDesign callerCoordinates,
                RobustnessReport robustness,
                RealLoopReport loop) {
            this(report, callerCoordinates, robustness, loop, null);
        }
    }

    @Override
    public Class<DesignRequest> requestType() {
        return DesignRequest.class;
    }

    @Override
    public Validated validate(DesignRequest request) {
        ValidatedDesign design = validator.validate(request);
        ValidatedVerify robust = request.robust() == null ? null : validateRobust(request.robust(), design);
        if (request.verify() == null) {
            return new Validated(design, null, List.of(), request.spec(), robust);
        }
        List<FieldError> errors = new ArrayList<>();
        ValidatedVerify verify = verifyValidator.validate(request.verify(), design.plant(), VERIFY_POINTER, errors);
        return new Validated(
                design, verify, verify == null ? VerifyLimits.capped(errors) : List.of(), request.spec(), robust);
    }

    /**
     * The robust member: its box and actuator limit are checked by the verify validator (the same wire types,
     * ranges and caps), under /robust. The design depends on them, so their errors are a 400 at once.
     */
    private ValidatedVerify validateRobust(RobustInput robust, ValidatedDesign design) {
        List<FieldError> errors = new ArrayList<>();
        if (robust.uncertainty() == null) {
            errors.add(new FieldError(ROBUST_POINTER + "/uncertainty", "required: the parameter box to design for"));
            throw new InvalidRequestException(errors);
        }
        Double samplePeriod = robust.samplePeriod();
        if (samplePeriod != null
                && !(samplePeriod >= VerifyLimits.MIN_SAMPLE_PERIOD && samplePeriod <= VerifyLimits.MAX_TIME_SECONDS)) {
            errors.add(new FieldError(
                    ROBUST_POINTER + "/samplePeriod",
                    "must be from " + VerifyLimits.MIN_SAMPLE_PERIOD + " to " + (long) VerifyLimits.MAX_TIME_SECONDS
                            + " s (the range of verify.sampling.samplePeriod)"));
        }
        // the period rides in the options' sampling slot (already checked here, with the robust pointer)
        SamplingInput sampling =
                samplePeriod == null || !errors.isEmpty() ? null : new SamplingInput(samplePeriod, null);
        ValidatedVerify validated = verifyValidator.validate(
                new VerifyInput(robust.uncertainty(), null, robust.actuatorLimit(), sampling, null, null, null, null),
                design.plant(),
                ROBUST_POINTER,
                errors);
        if (validated == null || !errors.isEmpty()) {
            throw new InvalidRequestException(VerifyLimits.capped(errors));
        }
        if ((design.loop() != null || samplePeriod != null)
                && validated.options().monteCarloSamples() > RobustDesignPipeline.MAX_LOOP_SAMPLES) {
            throw new InvalidRequestException(List.of(new FieldError(
                    ROBUST_POINTER + "/uncertainty/monteCarloSamples",
                    "at most " + RobustDesignPipeline.MAX_LOOP_SAMPLES + " samples for a robust design with integral"
                            + " action, position-only sensing or a samplePeriod (each case is a simulated step)")));
        }
        return validated;
    }

    @Override
    public List<FieldError> deferredErrors(Validated validated) {
        return validated.verifyErrors();
    }

    @Override
    public Result compute(Validated validated) {
        ValidatedDesign design = validated.design();
        // the loop that runs first: an infeasible augmented design is named with its own proposal
        RealLoopReport loop = null;
        if (design.loop() != null && validated.robust() == null) {
            loop = realLoops.design(RealLoopPipeline.Request.canonical(
                    design.plant(),
                    design.spec(),
                    design.gammaChoice(),
                    design.loop().structure(),
                    design.loop().loadStepSize()));
        }
        RobustDesignReport robustDesign = null;
        DesignReport report;
        if (validated.robust() != null && design.loop() != null) {
            RobustnessOptions box = validated.robust().options();
            robustDesign = robustDesigns.designLoop(
                    design.plant(),
                    design.spec(),
                    design.gammaChoice(),
                    design.loop().structure(),
                    design.loop().loadStepSize(),
                    design.stepSize(),
                    design.bandFraction(),
                    box.parameterBox(),
                    box.monteCarloSamples(),
                    box.seed(),
                    box.actuatorLimit(),
                    box.samplePeriod());
            loop = robustDesign.loop();
            report = robustDesign.report();
        } else if (validated.robust() != null) {
            RobustnessOptions box = validated.robust().options();
            robustDesign = robustDesigns.design(
                    design.plant(),
                    design.spec(),
                    design.gammaChoice(),
                    design.stepSize(),
                    design.bandFraction(),
                    box.parameterBox(),
                    box.monteCarloSamples(),
                    box.seed(),
                    box.actuatorLimit(),
                    box.samplePeriod());
            report = robustDesign.report();
        } else {
            report = designs.design(
                    design.plant(), design.spec(), design.gammaChoice(), design.stepSize(), design.bandFraction());
        }
        if (!validated.verifyErrors().isEmpty()) {
            throw new InvalidRequestException(validated.verifyErrors());
        }
        RobustnessReport checked = null;
        if (validated.verify() != null) {
            ClosedFormDesign closedForm = report.design();
            checked = robustness.check(
                    design.plant(),
                    gains(closedForm),
                    design.stepSize(),
                    limits(design),
                    closedForm.rho1(),
                    closedForm.rho2(),
                    gamma(closedForm),
                    validated.verify().options(),
                    validated.verify().toleranceFraction());
        }
        StateSpaceDesign callerCoordinates =
                designs.callerCoordinates(design.resolvedPlant().source(), report.design(), loop);
        return new Result(report, callerCoordinates, checked, loop, robustDesign);
    }

    @Override
    public Object respond(Validated validated, Result result) {
        RobustnessResponse robustnessResponse = null;
        if (result.robustness() != null) {
            ClosedFormDesign closedForm = result.report().design();
            ValidatedVerify verify = validated.verify();
            robustnessResponse = robustnessResponses.toResponse(
                    result.robustness(),
                    limits(validated.design()),
                    100 * verify.toleranceFraction(),
                    validated.design().stepSize(),
                    WEIGHTED_OUTPUT,
                    gamma(closedForm),
                    verify.options().seriesPoints());
        }
        return responses.toResponse(
                validated.design(),
                result.report(),
                result.callerCoordinates(),
                robustnessResponse,
                validated.verify() == null ? null : validated.verify().options(),
                result.loop() == null
                        ? null
                        : loopResponses.toSections(
                                result.loop(),
                                result.callerCoordinates() == null ? CANONICAL_COORDINATES : CANONICAL_NOT_CALLER,
                                lawFormula(result.loop()),
                                validated.design().loop().samplePeriod()),
                result.robustDesign() == null ? null : robustDesignResponses.toResponse(result.robustDesign()));
    }

    @Override
    public Problem nonFinite(String pointer) {
        return FailureTable.unverifiable(
                "the design's " + (pointer.isEmpty() ? "result" : pointer) + " is outside double precision");
    }

    @Override
    public FailureContext failureContext(Validated validated) {
        return validated == null
                ? FailureContext.ROOT
                : FailureContext.ROOT
                        .withTimeSpec(validated.design().timeSpecPointer())
                        .withSentSpec(validated.sentSpec());
    }

    private static String lawFormula(RealLoopReport loop) {
        String state = loop.observer() == null ? "(k1*x1 + k2*x2)" : "(k1*x1_hat + k2*x2_hat)";
        return loop.law().integralAction() ? "u = kr*r + ki*xi - " + state + ", xi' = r - x1" : "u = kr*r - " + state;
    }

    private static FeedbackGains gains(ClosedFormDesign design) {
        return new FeedbackGains(design.positionGain(), design.velocityGain(), design.referenceGain());
    }

    /** The bound the disturbance gain is judged against: none without a disturbance input (d = 0). */
    private static Double gamma(ClosedFormDesign design) {
        return design.plant().d() == 0 ? null : design.gamma();
    }

    /** The spec as given, in the verifier's terms (the tolerance widens it before judging). */
    private static AcceptanceLimits limits(ValidatedDesign design) {
        TimeSpec timeSpec = design.spec().timeSpec();
        return new AcceptanceLimits(
                timeSpec instanceof TimeSpec.SettlingTime ? timeSpec.seconds() : null,
                timeSpec instanceof TimeSpec.RiseTime ? timeSpec.seconds() : null,
                100 * design.spec().overshootFraction(),
                design.bandFraction());
    }
}
