package com.loopwright.service.security;

import io.javalin.http.Context;

/** Response headers for an API that serves no HTML: no sniffing, no framing, no caching, no referrer. */
public final class SecurityHeaders {

    private SecurityHeaders() {}

    public static void apply(Context ctx) {
        ctx.header("X-Content-Type-Options", "nosniff");
        ctx.header("X-Frame-Options", "DENY");
        ctx.header("Content-Security-Policy", "default-src 'none'; frame-ancestors 'none'");
        ctx.header("Referrer-Policy", "no-referrer");
        ctx.header("Cache-Control", "no-store");
        ctx.header("Cross-Origin-Resource-Policy", "same-origin");
    }
}
