package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.mapping.DesignResponseMapper;
import com.loopwright.api.mapping.ProblemMapper;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.request.DesignRequest;
import com.loopwright.api.request.DesignRequestValidator;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.api.request.ValidatedDesign;
import com.loopwright.api.request.ValidatedVerify;
import com.loopwright.api.request.VerifyInputValidator;
import com.loopwright.api.request.VerifyLimits;
import com.loopwright.api.response.RobustnessResponse;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.plant.PlantParameterException;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.FeedbackGains;
import com.loopwright.solver.spec.TimeSpec;
import com.loopwright.solver.verify.VerificationFailedException;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;

/**
 * One design request from JSON to JSON, without HTTP: decode strictly, validate, design, map, and guard
 * against non-finite numbers. Every failure becomes a problem; stateless and thread-safe.
 */
public final class DesignExchange {

    private final ObjectMapper mapper;
    private final DesignRequestValidator validator = new DesignRequestValidator();
    private final LoopDesigner designer = new LoopDesigner();
    private final DesignResponseMapper responses = new DesignResponseMapper();
    private final ProblemMapper problems = new ProblemMapper();
    private final VerifyInputValidator verifyValidator = new VerifyInputValidator();
    private final RobustnessRunner robustnessRunner = new RobustnessRunner();

    public DesignExchange(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    /** A raw request body. */
    public Outcome exchange(byte[] body) {
        DesignRequest request;
        try {
            request = mapper.readValue(body, DesignRequest.class);
        } catch (JsonProcessingException e) {
            return failure(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return failure(DecodeFailures.unreadable());
        }
        return exchange(request);
    }

    /** An already parsed JSON value (for example one item of a batch). */
    public Outcome exchange(JsonNode item) {
        DesignRequest request;
        try {
            request = mapper.treeToValue(item, DesignRequest.class);
        } catch (JsonProcessingException e) {
            return failure(DecodeFailures.toProblem(e));
        }
        return exchange(request);
    }

    /** A decoded request. */
    public Outcome exchange(DesignRequest request) {
        ValidatedDesign design;
        try {
            design = validator.validate(request);
        } catch (InvalidRequestException e) {
            return failure(problems.invalid(e));
        } catch (PlantParameterException e) {
            return failure(problems.plantModel(e));
        }
        DesignReport report;
        try {
            report = designer.design(design.plant(), design.spec(), design.gammaChoice(), design.stepSize(),
                    design.bandFraction());
        } catch (InfeasibleDesignException e) {
            return failure(problems.infeasible(e.infeasibility(), design.timeSpecPointer()));
        } catch (VerificationFailedException e) {
            return failure(problems.unverifiable(e.getMessage()));
        }
        RobustnessResponse robustness = null;
        if (request.verify() != null) {
            List<FieldError> errors = new ArrayList<>();
            ValidatedVerify verify = verifyValidator.validate(request.verify(), design.plant(), "/verify", errors);
            if (verify == null) {
                return failure(problems.invalid(new InvalidRequestException(VerifyLimits.capped(errors))));
            }
            ClosedFormDesign closedForm = report.design();
            TimeSpec timeSpec = design.spec().timeSpec();
            AcceptanceLimits limits = new AcceptanceLimits(
                    timeSpec instanceof TimeSpec.SettlingTime ? timeSpec.seconds() : null,
                    timeSpec instanceof TimeSpec.RiseTime ? timeSpec.seconds() : null,
                    100 * design.spec().overshootFraction(), design.bandFraction());
            RobustnessRunner.Result result = robustnessRunner.run(design.plant(),
                    new FeedbackGains(closedForm.positionGain(), closedForm.velocityGain(), closedForm.referenceGain()),
                    design.stepSize(), limits, closedForm.rho1(), closedForm.rho2(),
                    design.plant().d() == 0 ? null : closedForm.gamma(), verify, "/verify");
            if (result.problem() != null) {
                return failure(result.problem());
            }
            robustness = result.response();
        }
        JsonNode tree = mapper.valueToTree(responses.toResponse(design, report, robustness));
        String nonFinite = FiniteNumbers.firstNonFinite(tree);
        if (nonFinite != null) {
            return failure(problems.unverifiable(
                    "the design's " + (nonFinite.isEmpty() ? "result" : nonFinite) + " is outside double precision"));
        }
        return new Outcome(200, tree, null);
    }

    private Outcome failure(Problem problem) {
        return new Outcome(problem.status(), mapper.valueToTree(problem), problem);
    }
}
