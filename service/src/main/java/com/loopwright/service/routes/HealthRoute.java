package com.loopwright.service.routes;

import io.javalin.http.Context;
import io.javalin.http.Handler;

/** GET /health and GET /health/live: the process answers HTTP. */
public final class HealthRoute implements Handler {

    public static final String PATH = "/health";
    public static final String LIVE_PATH = "/health/live";
    private static final byte[] UP = "{\"status\":\"up\"}".getBytes(java.nio.charset.StandardCharsets.UTF_8);

    @Override
    public void handle(Context ctx) {
        ctx.contentType("application/json").result(UP);
    }
}
