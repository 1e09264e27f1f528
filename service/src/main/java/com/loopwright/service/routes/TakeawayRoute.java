package com.loopwright.service.routes;

import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.endpoint.Trace;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.compute.ComputePool;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.util.function.BiFunction;
import java.util.function.Consumer;

/**
 * POST /v1/designs/plots/{figure} and /v1/designs/controllers/{format}: a JSON body and one path parameter in,
 * a text artifact (SVG, Structured Text, C, PLCopen XML, JSON; a controller export as an attachment with its file
 * name) or a problem out, computed on the bounded pool.
 */
public final class TakeawayRoute implements Handler {

    public static final String PLOTS_PATH = "/v1/designs/plots/{figure}";
    public static final String CONTROLLERS_PATH = "/v1/designs/controllers/{format}";

    private final String parameter;
    private final BiFunction<String, byte[], Reply> work;
    private final ProblemResponses problems;
    private final ComputePool pool;
    private final Consumer<Reply> afterwards;

    /**
     * @param parameter the path parameter handed to {@code work} with the body (figure or format)
     */
    public TakeawayRoute(
            String parameter, BiFunction<String, byte[], Reply> work, ProblemResponses problems, ComputePool pool) {
        this(parameter, work, problems, pool, outcome -> {});
    }

    /**
     * The same, with a look at every reply before it is written.
     *
     * @param afterwards sees every reply before it is written (for example to count computations by outcome)
     */
    public TakeawayRoute(
            String parameter,
            BiFunction<String, byte[], Reply> work,
            ProblemResponses problems,
            ComputePool pool,
            Consumer<Reply> afterwards) {
        this.parameter = parameter;
        this.work = work;
        this.problems = problems;
        this.pool = pool;
        this.afterwards = afterwards;
    }

    @Override
    public void handle(Context ctx) {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(
                    ctx,
                    ProblemType.UNSUPPORTED_MEDIA_TYPE.problem("send the request with Content-Type: application/json"));
            return;
        }
        String value = ctx.pathParam(parameter);
        byte[] body = ctx.bodyAsBytes();
        Reply takeaway = pool.run(() -> work.apply(value, body), Reply::failure);
        afterwards.accept(takeaway);
        if (takeaway.requestDigest() != null) {
            ctx.header(Trace.DIGEST_HEADER, takeaway.requestDigest());
        }
        if (!takeaway.ok()) {
            if (takeaway.status() == 503) {
                ctx.header("Retry-After", String.valueOf(ComputePool.RETRY_AFTER_SECONDS));
            }
            problems.write(ctx, takeaway.problem());
            return;
        }
        if (takeaway.fileName() != null) {
            // the api allows only [A-Za-z0-9_.-] in a file name: quoted as is, nothing to escape
            ctx.header("Content-Disposition", "attachment; filename=\"" + takeaway.fileName() + "\"");
        }
        ctx.status(200).contentType(takeaway.mediaType()).result(takeaway.body());
    }
}
