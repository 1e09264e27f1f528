package com.loopwright.service.routes;

import com.loopwright.api.exchange.TakeawayExchange;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;

/** POST /v1/designs/plots/{figure}: the design drawn as an SVG figure. */
public final class PlotRoute implements Handler {

    public static final String PATH = "/v1/designs/plots/{figure}";

    private final ProblemResponses problems;
    private final TakeawayExchange exchange;

    public PlotRoute(TakeawayExchange exchange, ProblemResponses problems) {
        this.exchange = exchange;
        this.problems = problems;
    }

    @Override
    public void handle(Context ctx) {
        TakeawayRoutes.answer(ctx, problems, () -> exchange.plot(ctx.pathParam("figure"), ctx.bodyAsBytes()));
    }
}
