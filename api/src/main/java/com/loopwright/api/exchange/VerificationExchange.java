package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.mapping.ProblemMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.api.request.ValidatedVerification;
import com.loopwright.api.request.VerificationRequest;
import com.loopwright.api.request.VerificationRequestValidator;
import com.loopwright.api.response.RobustnessResponse;
import com.loopwright.api.response.VerificationResponse;
import java.io.IOException;

/** One verification request (plant, gains, checks) from JSON to JSON without HTTP. Stateless and thread-safe. */
public final class VerificationExchange {

    private final ObjectMapper mapper;
    private final VerificationRequestValidator validator = new VerificationRequestValidator();
    private final RobustnessRunner runner = new RobustnessRunner();
    private final ProblemMapper problems = new ProblemMapper();

    public VerificationExchange(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    public Outcome exchange(byte[] body) {
        VerificationRequest request;
        try {
            request = mapper.readValue(body, VerificationRequest.class);
        } catch (JsonProcessingException e) {
            return failure(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return failure(DecodeFailures.unreadable());
        }
        ValidatedVerification v;
        try {
            v = validator.validate(request);
        } catch (InvalidRequestException e) {
            return failure(problems.invalid(e));
        }
        RobustnessRunner.Result result = runner.run(v.plant(), v.gains(), v.stepSize(), v.limits(), v.rho1(), v.rho2(),
                v.gamma(), v.verify(), "/verify");
        if (result.problem() != null) {
            return failure(result.problem());
        }
        VerificationResponse response = new VerificationResponse(
                new RobustnessResponse.PlantView(v.plant().a0(), v.plant().a1(), v.plant().b(), v.plant().d()),
                new RobustnessResponse.GainView(v.gains().positionGain(), v.gains().velocityGain(),
                        v.gains().referenceGain()), result.response());
        JsonNode tree = mapper.valueToTree(response);
        String nonFinite = FiniteNumbers.firstNonFinite(tree);
        if (nonFinite != null) {
            return failure(problems.unverifiable("the verification's " + (nonFinite.isEmpty() ? "result" : nonFinite)
                    + " is outside double precision"));
        }
        return new Outcome(200, tree, null);
    }

    private Outcome failure(Problem problem) {
        return new Outcome(problem.status(), mapper.valueToTree(problem), problem);
    }
}
