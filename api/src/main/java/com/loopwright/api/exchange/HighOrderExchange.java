package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.mapping.HighOrderResponseMapper;
import com.loopwright.api.mapping.ProblemMapper;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.request.HighOrderDesignRequest;
import com.loopwright.api.request.HighOrderRequestValidator;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.api.request.ValidatedHighOrderDesign;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.highorder.CompanionPlant;
import com.loopwright.solver.highorder.CompanionTransform;
import com.loopwright.solver.highorder.DesiredPoles;
import com.loopwright.solver.highorder.HighOrderDesign;
import com.loopwright.solver.highorder.HighOrderDesigner;
import com.loopwright.solver.highorder.HighOrderVerification;
import com.loopwright.solver.highorder.HighOrderVerifier;
import com.loopwright.solver.highorder.PoleMatchedRiccati;
import com.loopwright.solver.highorder.SpecMatch;
import com.loopwright.solver.highorder.SpecMatcher;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import com.loopwright.solver.verify.VerificationFailedException;
import java.io.IOException;
import java.util.List;

/** One high-order design request from JSON to JSON, without HTTP; every failure becomes a problem. */
public final class HighOrderExchange {

    private static final String TIME_SPEC_POINTER = "/spec/settlingTime";

    private final ObjectMapper mapper;
    private final HighOrderRequestValidator validator = new HighOrderRequestValidator();
    private final SpecMatcher matcher = new SpecMatcher();
    private final HighOrderDesigner designer = new HighOrderDesigner();
    private final HighOrderVerifier verifier = new HighOrderVerifier();
    private final HighOrderResponseMapper responses = new HighOrderResponseMapper();
    private final ProblemMapper problems = new ProblemMapper();

    public HighOrderExchange(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    public Outcome exchange(byte[] body) {
        HighOrderDesignRequest request;
        try {
            request = mapper.readValue(body, HighOrderDesignRequest.class);
        } catch (JsonProcessingException e) {
            return failure(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return failure(DecodeFailures.unreadable());
        }
        return exchange(request);
    }

    public Outcome exchange(HighOrderDesignRequest request) {
        ValidatedHighOrderDesign input;
        try {
            input = validator.validate(request);
        } catch (InvalidRequestException e) {
            return failure(problems.invalid(e));
        }
        CompanionTransform.Result transform = null;
        CompanionPlant plant = input.plant();
        if (input.stateSpace() != null) {
            ValidatedHighOrderDesign.StateSpace ss = input.stateSpace();
            try {
                transform = new CompanionTransform().transform(ss.a(), ss.b2(), ss.b1(), ss.output());
            } catch (CompanionTransform.UncontrollableException e) {
                return failure(ProblemType.INFEASIBLE_SPEC.problem(e.getMessage(),
                        List.of(new FieldError("/plant/stateSpace/b2", e.getMessage())), List.of()));
            }
            plant = transform.plant();
            if (!(Math.abs(plant.numerator()[0]) > 1e-12 * norm(plant.numerator()))) {
                String reason = "the output has a zero at s = 0 (no DC gain), so the reference cannot be scaled to it";
                return failure(ProblemType.INFEASIBLE_SPEC.problem(reason,
                        List.of(new FieldError("/plant/stateSpace/output", reason)), List.of()));
            }
        }
        SpecMatch match = null;
        HighOrderDesign design;
        HighOrderVerification verification;
        try {
            TargetDynamics target;
            if (input.matchSpecs()) {
                match = matcher.match(plant, input.spec(), input.auxiliary(), input.stepSize(),
                        input.maxUndershootPercent());
                target = match.target();
            } else {
                target = new SpecInverter().invert(input.spec()).target();
            }
            DesiredPoles poles = input.auxiliary().place(target, plant.order());
            design = designer.design(plant, poles, input.gammaChoice());
            verification = verifier.verify(design, input.stepSize(), input.bandFraction(),
                    ((TimeSpec.SettlingTime) input.spec().timeSpec()).seconds());
        } catch (InfeasibleDesignException e) {
            return failure(problems.infeasible(e.infeasibility(), TIME_SPEC_POINTER));
        } catch (VerificationFailedException | PoleMatchedRiccati.SystemFailure e) {
            return failure(problems.unverifiable(e.getMessage()));
        } catch (IllegalArgumentException e) {
            // a simulation or eigenvalue step outside its range (for example a step response that never settles
            // inside the horizon): the design cannot be verified
            return failure(problems.unverifiable("the closed loop could not be simulated or checked: " + e.getMessage()));
        }
        JsonNode tree = mapper.valueToTree(responses.toResponse(input, transform, match, design, verification));
        String nonFinite = FiniteNumbers.firstNonFinite(tree);
        if (nonFinite != null) {
            return failure(problems.unverifiable(
                    "the design's " + (nonFinite.isEmpty() ? "result" : nonFinite) + " is outside double precision"));
        }
        return new Outcome(200, tree, null);
    }

    private static double norm(double[] v) {
        double s = 0;
        for (double x : v) {
            s = Math.hypot(s, x);
        }
        return s;
    }

    private Outcome failure(Problem problem) {
        return new Outcome(problem.status(), mapper.valueToTree(problem), problem);
    }
}
