package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.mapping.FitResponseMapper;
import com.loopwright.api.mapping.ProblemMapper;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.request.FitRequest;
import com.loopwright.api.request.FitRequestValidator;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.api.request.ValidatedFit;
import com.loopwright.solver.fit.FitFailedException;
import com.loopwright.solver.fit.StepFit;
import com.loopwright.solver.fit.StepResponseFitter;
import java.io.IOException;
import java.util.List;

/** One fit request from JSON to JSON, without HTTP. Stateless and thread-safe. */
public final class FitExchange {

    private final ObjectMapper mapper;
    private final FitRequestValidator validator = new FitRequestValidator();
    private final StepResponseFitter fitter = new StepResponseFitter();
    private final FitResponseMapper responses = new FitResponseMapper();
    private final ProblemMapper problems = new ProblemMapper();

    public FitExchange(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    public Outcome exchange(byte[] body) {
        FitRequest request;
        try {
            request = mapper.readValue(body, FitRequest.class);
        } catch (JsonProcessingException e) {
            return failure(DecodeFailures.toProblem(e));
        } catch (IOException e) {
            return failure(DecodeFailures.unreadable());
        }
        ValidatedFit fit;
        try {
            fit = validator.validate(request);
        } catch (InvalidRequestException e) {
            return failure(problems.invalid(e));
        }
        StepFit result;
        try {
            result = fitter.fit(fit.data(), fit.options());
        } catch (FitFailedException e) {
            return failure(ProblemType.FIT_FAILED.problem(e.getMessage(),
                    List.of(new FieldError("/samples/output", e.getMessage())), List.of()));
        }
        JsonNode tree = mapper.valueToTree(responses.toResponse(fit, result));
        String nonFinite = FiniteNumbers.firstNonFinite(tree);
        if (nonFinite != null) {
            return failure(ProblemType.FIT_FAILED.problem("the fitted " + nonFinite + " is outside double"
                    + " precision; rescale the samples", List.of(new FieldError("/samples/output",
                    "outside double precision")), List.of()));
        }
        return new Outcome(200, tree, null);
    }

    private Outcome failure(Problem problem) {
        return new Outcome(problem.status(), mapper.valueToTree(problem), problem);
    }
}
