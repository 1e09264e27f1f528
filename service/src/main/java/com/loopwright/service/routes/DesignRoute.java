package com.loopwright.service.routes;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.Outcome;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.compute.ComputePool;
import com.loopwright.service.compute.Designs;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.service.observe.Metrics;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;

/** POST /v1/designs: a plant and specs in, a verified design or a problem out; computed on the bounded pool. */
public final class DesignRoute implements Handler {

    public static final String PATH = "/v1/designs";

    private final ObjectMapper mapper;
    private final ProblemResponses problems;
    private final Designs designs;
    private final ComputePool pool;
    private final Metrics metrics;

    public DesignRoute(ObjectMapper mapper, ProblemResponses problems, Designs designs, ComputePool pool,
                       Metrics metrics) {
        this.mapper = mapper;
        this.problems = problems;
        this.designs = designs;
        this.pool = pool;
        this.metrics = metrics;
    }

    @Override
    public void handle(Context ctx) throws IOException {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(ctx, ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                    "send the design request with Content-Type: application/json"));
            return;
        }
        byte[] body = ctx.bodyAsBytes();
        Outcome outcome = pool.run(() -> designs.design(body));
        metrics.design(Metrics.outcomeOf(outcome));
        if (!outcome.ok()) {
            if (outcome.status() == 503) {
                ctx.header("Retry-After", String.valueOf(ComputePool.RETRY_AFTER_SECONDS));
            }
            problems.write(ctx, outcome.problem());
            return;
        }
        ctx.status(200).contentType(JsonBodies.JSON).result(mapper.writeValueAsBytes(outcome.body()));
    }
}
