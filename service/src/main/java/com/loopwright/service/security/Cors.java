package com.loopwright.service.security;

import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.http.ProblemException;
import io.javalin.http.Context;
import java.util.List;
import java.util.Set;

/**
 * CORS for browser dashboards, off unless origins are configured. Only exact configured origins are echoed
 * (never "*"); a preflight from any other origin is a 403 problem.
 */
public final class Cors {

    static final String ALLOWED_METHODS = "GET, POST, OPTIONS";
    static final String ALLOWED_HEADERS = "Content-Type, Authorization, X-Api-Key, X-Request-Id";
    static final String EXPOSED_HEADERS = "X-Request-Id, Retry-After, Content-Disposition";
    static final int PREFLIGHT_MAX_AGE_SECONDS = 600;

    private final Set<String> origins;

    public Cors(List<String> origins) {
        this.origins = Set.copyOf(origins);
    }

    public boolean enabled() {
        return !origins.isEmpty();
    }

    /** Adds the response headers of a simple (non-preflight) request from an allowed origin. */
    public void decorate(Context ctx) {
        String origin = ctx.header("Origin");
        if (origin != null && origins.contains(origin)) {
            ctx.header("Access-Control-Allow-Origin", origin);
            ctx.header("Access-Control-Expose-Headers", EXPOSED_HEADERS);
            ctx.header("Vary", "Origin");
        }
    }

    /** OPTIONS preflight: 204 with the allowed methods and headers, or a 403 problem. */
    public void preflight(Context ctx) {
        String origin = ctx.header("Origin");
        if (origin == null || !origins.contains(origin)) {
            throw new ProblemException(ProblemType.FORBIDDEN.problem("this origin is not allowed by CORS"));
        }
        ctx.header("Access-Control-Allow-Origin", origin);
        ctx.header("Access-Control-Allow-Methods", ALLOWED_METHODS);
        ctx.header("Access-Control-Allow-Headers", ALLOWED_HEADERS);
        ctx.header("Access-Control-Max-Age", String.valueOf(PREFLIGHT_MAX_AGE_SECONDS));
        ctx.header("Vary", "Origin");
        ctx.status(204);
    }
}
