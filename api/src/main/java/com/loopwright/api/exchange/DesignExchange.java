package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.json.FiniteNumbersModule;
import com.loopwright.api.json.NonFiniteNumberException;
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
import com.loopwright.api.response.DesignResponse;
import com.loopwright.api.response.RobustnessResponse;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.plant.PlantParameterException;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.loop.FeedbackGains;
import com.loopwright.solver.spec.TimeSpec;
import com.loopwright.solver.verify.VerificationFailedException;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;

/**
 * One design request from JSON to JSON, without HTTP: decode strictly, validate, design, map, and guard
 * against non-finite numbers. Every failure becomes a problem; stateless and thread-safe.
 * <p>
 * Two ends: {@link #encode} writes the response record straight to bytes (the HTTP path), {@link #exchange}
 * gives it as a JSON tree (for callers that inspect it). Both serialize through {@link FiniteNumbersModule}, whose
 * serializers refuse NaN and Infinity with the value's JSON pointer; that refusal becomes the same
 * unverifiable-design problem either way.
 */
public final class DesignExchange {

    private final ObjectMapper mapper;
    private final ObjectMapper writer;
    private final DesignRequestValidator validator = new DesignRequestValidator();
    private final LoopDesigner designer = new LoopDesigner(com.loopwright.api.request.FieldLimits.SPEC_RANGES);
    private final DesignResponseMapper responses = new DesignResponseMapper();
    private final ProblemMapper problems = new ProblemMapper();
    private final VerifyInputValidator verifyValidator = new VerifyInputValidator();
    private final RobustnessRunner robustnessRunner = new RobustnessRunner();

    public DesignExchange(ObjectMapper mapper) {
        this.mapper = mapper;
        this.writer = FiniteNumbersModule.responseWriter(mapper);
    }

    /** A raw request body. */
    public Outcome exchange(byte[] body) {
        return toTree(compute(body));
    }

    /** An already parsed JSON value (for example one item of a batch). */
    public Outcome exchange(JsonNode item) {
        return toTree(compute(item));
    }

    /** A decoded request. */
    public Outcome exchange(DesignRequest request) {
        return toTree(compute(request));
    }

    /** A raw request body, answered as JSON bytes. */
    public EncodedOutcome encode(byte[] body) {
        return toBytes(compute(body));
    }

    /** An already parsed JSON value (for example one item of a batch), answered as JSON bytes. */
    public EncodedOutcome encode(JsonNode item) {
        return toBytes(compute(item));
    }

    private Computed compute(byte[] body) {
        DesignRequest request;
        try {
            request = mapper.readValue(body, DesignRequest.class);
        } catch (JsonProcessingException e) {
            return failed(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return failed(DecodeFailures.unreadable());
        }
        return compute(request);
    }

    private Computed compute(JsonNode item) {
        DesignRequest request;
        try {
            request = mapper.treeToValue(item, DesignRequest.class);
        } catch (JsonProcessingException e) {
            return failed(DecodeFailures.toProblem(e));
        }
        return compute(request);
    }

    private Computed compute(DesignRequest request) {
        ValidatedDesign design;
        try {
            design = validator.validate(request);
        } catch (InvalidRequestException e) {
            return failed(problems.invalid(e));
        } catch (PlantParameterException e) {
            return failed(problems.plantModel(e));
        }
        DesignReport report;
        try {
            report = designer.design(design.plant(), design.spec(), design.gammaChoice(), design.stepSize(),
                    design.bandFraction());
        } catch (InfeasibleDesignException e) {
            return failed(problems.infeasible(e.infeasibility(), design.timeSpecPointer()));
        } catch (VerificationFailedException e) {
            return failed(problems.unverifiable(e.getMessage()));
        }
        RobustnessResponse robustness = null;
        if (request.verify() != null) {
            List<FieldError> errors = new ArrayList<>();
            ValidatedVerify verify = verifyValidator.validate(request.verify(), design.plant(), "/verify", errors);
            if (verify == null) {
                return failed(problems.invalid(new InvalidRequestException(VerifyLimits.capped(errors))));
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
                return failed(result.problem());
            }
            robustness = result.response();
        }
        return new Computed(responses.toResponse(design, report, robustness), null);
    }

    private Outcome toTree(Computed computed) {
        if (computed.problem() != null) {
            return failure(computed.problem());
        }
        JsonNode tree;
        try {
            tree = writer.valueToTree(computed.response());
        } catch (IllegalArgumentException e) {
            NonFiniteNumberException nonFinite = NonFiniteNumberException.in(e);
            if (nonFinite == null) {
                throw e;
            }
            return failure(outsideDoublePrecision(nonFinite));
        }
        return new Outcome(200, tree, null);
    }

    private EncodedOutcome toBytes(Computed computed) {
        if (computed.problem() != null) {
            return EncodedOutcome.failure(computed.problem());
        }
        try {
            return EncodedOutcome.owning(writer.writeValueAsBytes(computed.response()));
        } catch (NonFiniteNumberException e) {
            return EncodedOutcome.failure(outsideDoublePrecision(e));
        } catch (JsonProcessingException e) {
            NonFiniteNumberException nonFinite = NonFiniteNumberException.in(e);
            if (nonFinite == null) {
                throw new IllegalStateException("a design response could not be written", e);
            }
            return EncodedOutcome.failure(outsideDoublePrecision(nonFinite));
        }
    }

    /** The problem the never-NaN guarantee gives (the wording FiniteNumbers' tree walk used before). */
    private Problem outsideDoublePrecision(NonFiniteNumberException e) {
        String pointer = e.pointer();
        return problems.unverifiable("the design's " + (pointer.isEmpty() ? "result" : pointer)
                + " is outside double precision");
    }

    private static Computed failed(Problem problem) {
        return new Computed(null, problem);
    }

    private Outcome failure(Problem problem) {
        return new Outcome(problem.status(), mapper.valueToTree(problem), problem);
    }

    /** Either the response record or the problem. */
    private record Computed(DesignResponse response, Problem problem) {
    }
}
