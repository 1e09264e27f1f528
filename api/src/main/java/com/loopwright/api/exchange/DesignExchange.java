package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.mapping.DesignResponseMapper;
import com.loopwright.api.mapping.ProblemMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.request.DesignRequest;
import com.loopwright.api.request.DesignRequestValidator;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.api.request.ValidatedDesign;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.plant.PlantParameterException;
import com.loopwright.solver.verify.VerificationFailedException;
import java.io.IOException;

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
        JsonNode tree = mapper.valueToTree(responses.toResponse(design, report));
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
