package com.loopwright.service.routes;

import com.loopwright.api.exchange.TakeawayExchange;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.service.compute.ComputePool;
import io.javalin.http.Context;
import io.javalin.http.Handler;

/** POST /v1/designs/controllers/{format}: the sampled law as Structured Text, C or a JSON parameter set. */
public final class ControllerRoute implements Handler {

    public static final String PATH = "/v1/designs/controllers/{format}";

    private final ProblemResponses problems;
    private final TakeawayExchange exchange;
    private final ComputePool pool;

    public ControllerRoute(TakeawayExchange exchange, ProblemResponses problems, ComputePool pool) {
        this.exchange = exchange;
        this.problems = problems;
        this.pool = pool;
    }

    @Override
    public void handle(Context ctx) {
        String format = ctx.pathParam("format");
        TakeawayRoutes.answer(ctx, problems, pool, body -> exchange.controller(format, body));
    }
}
