package com.loopwright.service.routes;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.mapping.DesignResponseMapper;
import com.loopwright.api.mapping.ProblemMapper;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.request.DesignRequest;
import com.loopwright.api.request.DesignRequestValidator;
import com.loopwright.api.request.InvalidRequestException;
import com.loopwright.api.request.ValidatedDesign;
import com.loopwright.service.http.FiniteNumbers;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import com.loopwright.solver.verify.VerificationFailedException;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;

/** POST /v1/designs: a plant and specs in, a verified design or a problem out. */
public final class DesignRoute implements Handler {

    public static final String PATH = "/v1/designs";

    private final ObjectMapper mapper;
    private final ProblemResponses problems;
    private final DesignRequestValidator validator = new DesignRequestValidator();
    private final LoopDesigner designer = new LoopDesigner();
    private final DesignResponseMapper responses = new DesignResponseMapper();
    private final ProblemMapper problemMapper = new ProblemMapper();

    public DesignRoute(ObjectMapper mapper, ProblemResponses problems) {
        this.mapper = mapper;
        this.problems = problems;
    }

    @Override
    public void handle(Context ctx) throws IOException {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(ctx, ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                    "send the design request with Content-Type: application/json"));
            return;
        }
        DesignRequest request;
        try {
            request = mapper.readValue(ctx.bodyAsBytes(), DesignRequest.class);
        } catch (JsonProcessingException e) {
            problems.write(ctx, DecodeFailures.toProblem(e));
            return;
        }
        ValidatedDesign design;
        try {
            design = validator.validate(request);
        } catch (InvalidRequestException e) {
            problems.write(ctx, problemMapper.invalid(e));
            return;
        }
        DesignReport report;
        try {
            report = designer.design(design.plant(), design.spec(), design.gammaChoice(), design.stepSize(),
                    design.bandFraction());
        } catch (InfeasibleDesignException e) {
            problems.write(ctx, problemMapper.infeasible(e.infeasibility(), design.timeSpecPointer()));
            return;
        } catch (VerificationFailedException e) {
            problems.write(ctx, problemMapper.unverifiable(e.getMessage()));
            return;
        }
        JsonNode body = mapper.valueToTree(responses.toResponse(design, report));
        String nonFinite = FiniteNumbers.firstNonFinite(body);
        if (nonFinite != null) {
            Problem problem = problemMapper.unverifiable(
                    "the design's " + (nonFinite.isEmpty() ? "result" : nonFinite) + " is outside double precision");
            problems.write(ctx, problem);
            return;
        }
        ctx.status(200).contentType(JsonBodies.JSON).result(mapper.writeValueAsBytes(body));
    }
}
