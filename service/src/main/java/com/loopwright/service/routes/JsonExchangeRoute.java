package com.loopwright.service.routes;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.Outcome;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.compute.ComputePool;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;
import java.util.function.Consumer;
import java.util.function.Function;

/**
 * A POST route whose work is one JSON-to-JSON exchange (a design, a model fit, a high-order design, a
 * verification):
 * checks the media type, runs the exchange on the bounded compute pool under its deadline, and writes the
 * result or the problem (503 with Retry-After when the pool is saturated).
 */
public final class JsonExchangeRoute implements Handler {

    private final ObjectMapper mapper;
    private final ProblemResponses problems;
    private final ComputePool pool;
    private final Function<byte[], Outcome> exchange;
    private final Consumer<Outcome> afterwards;

    public JsonExchangeRoute(ObjectMapper mapper, ProblemResponses problems, ComputePool pool,
                             Function<byte[], Outcome> exchange) {
        this(mapper, problems, pool, exchange, outcome -> { });
    }

    /**
     * @param afterwards sees every outcome before it is written (for example to count designs by outcome)
     */
    public JsonExchangeRoute(ObjectMapper mapper, ProblemResponses problems, ComputePool pool,
                             Function<byte[], Outcome> exchange, Consumer<Outcome> afterwards) {
        this.mapper = mapper;
        this.problems = problems;
        this.pool = pool;
        this.exchange = exchange;
        this.afterwards = afterwards;
    }

    @Override
    public void handle(Context ctx) throws IOException {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(ctx, ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                    "send the request body with Content-Type: application/json"));
            return;
        }
        byte[] body = ctx.bodyAsBytes();
        Outcome outcome = pool.run(() -> exchange.apply(body));
        afterwards.accept(outcome);
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
