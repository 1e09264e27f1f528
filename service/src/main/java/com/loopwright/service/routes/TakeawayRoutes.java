package com.loopwright.service.routes;

import com.loopwright.api.exchange.Takeaway;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.JsonBodies;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.api.problem.Problem;
import com.loopwright.service.compute.ComputePool;
import io.javalin.http.Context;
import java.nio.charset.StandardCharsets;
import java.util.function.Function;

/** The shared answer of the plot and controller routes: JSON body required, text or problem out. */
final class TakeawayRoutes {

    private TakeawayRoutes() {
    }

    static void answer(Context ctx, ProblemResponses problems, ComputePool pool, Function<byte[], Takeaway> work) {
        if (!JsonBodies.isJson(ctx.contentType())) {
            problems.write(ctx, ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(
                    "send the request with Content-Type: application/json"));
            return;
        }
        byte[] body = ctx.bodyAsBytes();
        Takeaway takeaway = pool.run(() -> work.apply(body),
                problem -> new Takeaway(problem.status(), Problem.MEDIA_TYPE, null, problem));
        if (!takeaway.ok()) {
            if (takeaway.status() == 503) {
                ctx.header("Retry-After", String.valueOf(ComputePool.RETRY_AFTER_SECONDS));
            }
            problems.write(ctx, takeaway.problem());
            return;
        }
        ctx.status(200).contentType(takeaway.mediaType()).result(takeaway.body().getBytes(StandardCharsets.UTF_8));
    }
}
