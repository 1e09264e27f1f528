package com.loopwright.service.routes;

import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.endpoint.Trace;
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
    private final Function<byte[], Reply> exchange;
    private final Consumer<Reply> afterwards;

    /** A route over an endpoint run (api.endpoint.EndpointRunner) that answers a body or a problem. */
    public JsonExchangeRoute(ProblemResponses problems, ComputePool pool, Function<byte[], Reply> exchange) {
        this(problems, pool, exchange, outcome -> {});
    }

    private JsonExchangeRoute(
            ProblemResponses problems, ComputePool pool, Function<byte[], Reply> exchange, Consumer<Reply> afterwards) {
        this.problems = problems;
        this.pool = pool;
        this.exchange = exchange;
        this.afterwards = afterwards;
    }

    /**
     * The same, with a look at every reply before it is written.
     *
     * @param afterwards sees every reply before it is written (for example to count designs by outcome)
     */
    public static JsonExchangeRoute encoded(
            ProblemResponses problems, ComputePool pool, Function<byte[], Reply> exchange, Consumer<Reply> afterwards) {
        return new JsonExchangeRoute(problems, pool, exchange, afterwards);
    }

    @Override
    public void handle(Context ctx) {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(
                    ctx,
                    ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                            "send the request body with Content-Type: application/json"));
            return;
        }
        byte[] body = ctx.bodyAsBytes();
        Reply outcome = pool.run(() -> exchange.apply(body), Reply::failure);
        afterwards.accept(outcome);
        if (outcome.requestDigest() != null) {
            ctx.header(Trace.DIGEST_HEADER, outcome.requestDigest());
        }
        if (!outcome.ok()) {
            if (outcome.status() == 503) {
                ctx.header("Retry-After", String.valueOf(ComputePool.RETRY_AFTER_SECONDS));
            }
            problems.write(ctx, outcome.problem());
            return;
        }
        ctx.status(200).contentType(outcome.mediaType()).result(outcome.bodyStream());
    }
}
