package com.loopwright.service.routes;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.FitExchange;
import com.loopwright.api.exchange.Outcome;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;

/** POST /v1/models/fit: samples of a step test in, a fitted second-order model (usable as a plant) out. */
public final class FitRoute implements Handler {

    public static final String PATH = "/v1/models/fit";

    private final ObjectMapper mapper;
    private final ProblemResponses problems;
    private final FitExchange exchange;

    public FitRoute(ObjectMapper mapper, ProblemResponses problems) {
        this.mapper = mapper;
        this.problems = problems;
        this.exchange = new FitExchange(mapper);
    }

    @Override
    public void handle(Context ctx) throws IOException {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(ctx, ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                    "send the samples with Content-Type: application/json"));
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
