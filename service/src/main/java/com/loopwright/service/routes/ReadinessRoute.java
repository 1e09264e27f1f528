package com.loopwright.service.routes;

import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.ProblemResponses;
import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.nio.charset.StandardCharsets;
import java.util.function.BooleanSupplier;

/**
 * GET /health/ready: 200 while the service takes designs; 503 problem once a shutdown has begun, so that the
 * load balancer stops sending new work while in-flight requests finish.
 */
public final class ReadinessRoute implements Handler {

    public static final String PATH = "/health/ready";
    private static final byte[] UP = "{\"status\":\"up\"}".getBytes(StandardCharsets.UTF_8);

    private final BooleanSupplier draining;
    private final ProblemResponses problems;

    public ReadinessRoute(BooleanSupplier draining, ProblemResponses problems) {
        this.draining = draining;
        this.problems = problems;
    }

    @Override
    public void handle(Context ctx) {
        if (draining.getAsBoolean()) {
            problems.write(ctx, ProblemType.NOT_READY.problem("the service is shutting down"));
            return;
        }
        ctx.contentType("application/json").result(UP);
    }
}
