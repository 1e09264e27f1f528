package com.loopwright.service.routes;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.EncodedOutcome;
import com.loopwright.api.exchange.Outcome;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.compute.ComputePool;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.util.function.Consumer;
import java.util.function.Function;

/**
 * A POST route whose work is one JSON-to-JSON exchange (a design, a model fit, a high-order design, a
 * verification):
 * checks the media type, runs the exchange on the bounded compute pool under its deadline, and writes the
 * result or the problem (503 with Retry-After when the pool is saturated). The response bytes are produced on
 * the worker, inside the deadline, so the request thread only copies them out.
 */
public final class JsonExchangeRoute implements Handler {

    private final ProblemResponses problems;
    private final ComputePool pool;
    private final Function<byte[], EncodedOutcome> exchange;
    private final Consumer<EncodedOutcome> afterwards;

    public JsonExchangeRoute(ObjectMapper mapper, ProblemResponses problems, ComputePool pool,
                             Function<byte[], Outcome> exchange) {
        this(problems, pool, written(mapper, exchange), outcome -> { });
    }

    private JsonExchangeRoute(ProblemResponses problems, ComputePool pool, Function<byte[], EncodedOutcome> exchange,
                              Consumer<EncodedOutcome> afterwards) {
        this.problems = problems;
        this.pool = pool;
        this.exchange = exchange;
        this.afterwards = afterwards;
    }

    /**
     * A route over an exchange that writes its own bytes (the design exchange).
     *
     * @param afterwards sees every outcome before it is written (for example to count designs by outcome)
     */
    public static JsonExchangeRoute encoded(ProblemResponses problems, ComputePool pool,
                                            Function<byte[], EncodedOutcome> exchange,
                                            Consumer<EncodedOutcome> afterwards) {
        return new JsonExchangeRoute(problems, pool, exchange, afterwards);
    }

    /** A tree-building exchange, its tree written to bytes on the worker. */
    private static Function<byte[], EncodedOutcome> written(ObjectMapper mapper, Function<byte[], Outcome> exchange) {
        return body -> {
            try {
                return EncodedOutcome.of(exchange.apply(body), mapper);
            } catch (JsonProcessingException e) {
                throw new IllegalStateException("a response tree could not be written", e);
            }
        };
    }

    @Override
    public void handle(Context ctx) {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(ctx, ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                    "send the request body with Content-Type: application/json"));
            return;
        }
        byte[] body = ctx.bodyAsBytes();
        EncodedOutcome outcome = pool.run(() -> exchange.apply(body), EncodedOutcome::failure);
        afterwards.accept(outcome);
        if (!outcome.ok()) {
            if (outcome.status() == 503) {
                ctx.header("Retry-After", String.valueOf(ComputePool.RETRY_AFTER_SECONDS));
            }
            problems.write(ctx, outcome.problem());
            return;
        }
        ctx.status(200).contentType(JsonBodies.JSON).result(outcome.jsonStream());
    }
}
