package com.loopwright.service.routes;

import com.loopwright.api.exchange.TakeawayExchange;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;

/** POST /v1/designs/controllers/{format}: the sampled law as Structured Text, C or a JSON parameter set. */
public final class ControllerRoute implements Handler {

    public static final String PATH = "/v1/designs/controllers/{format}";

    private final ProblemResponses problems;
    private final TakeawayExchange exchange;

    public ControllerRoute(TakeawayExchange exchange, ProblemResponses problems) {
        this.exchange = exchange;
        this.problems = problems;
    }

    @Override
    public void handle(Context ctx) {
        TakeawayRoutes.answer(ctx, problems, () -> exchange.controller(ctx.pathParam("format"), ctx.bodyAsBytes()));
    }
}
