package com.loopwright.service.routes;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.Outcome;
import com.loopwright.api.exchange.VerificationExchange;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;

/** POST /v1/verifications: a plant and gains the caller already has, robustness checks out. */
public final class VerificationRoute implements Handler {

    public static final String PATH = "/v1/verifications";

    private final ObjectMapper mapper;
    private final ProblemResponses problems;
    private final VerificationExchange exchange;

    public VerificationRoute(ObjectMapper mapper, ProblemResponses problems) {
        this.mapper = mapper;
        this.problems = problems;
        this.exchange = new VerificationExchange(mapper);
    }

    @Override
    public void handle(Context ctx) throws IOException {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(ctx, ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                    "send the verification request with Content-Type: application/json"));
            return;
        }
        Outcome outcome = exchange.exchange(ctx.bodyAsBytes());
        if (!outcome.ok()) {
            problems.write(ctx, outcome.problem());
            return;
        }
        ctx.status(200).contentType(JsonBodies.JSON).result(mapper.writeValueAsBytes(outcome.body()));
    }
}
