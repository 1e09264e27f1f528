package com.loopwright.service.routes;

import com.loopwright.api.exchange.TakeawayExchange;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.service.compute.ComputePool;
import io.javalin.http.Context;
import io.javalin.http.Handler;

/** POST /v1/designs/plots/{figure}: the design drawn as an SVG figure. */
public final class PlotRoute implements Handler {

    public static final String PATH = "/v1/designs/plots/{figure}";

    private final ProblemResponses problems;
    private final TakeawayExchange exchange;
    private final ComputePool pool;

    public PlotRoute(TakeawayExchange exchange, ProblemResponses problems, ComputePool pool) {
        this.exchange = exchange;
        this.problems = problems;
        this.pool = pool;
    }

    @Override
    public void handle(Context ctx) {
        String figure = ctx.pathParam("figure");
        TakeawayRoutes.answer(ctx, problems, pool, body -> exchange.plot(figure, body));
    }
}
