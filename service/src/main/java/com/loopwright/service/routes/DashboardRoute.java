package com.loopwright.service.routes;

import io.javalin.http.Context;
import io.javalin.http.Handler;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;

/** GET /: the static dashboard page (one self-contained HTML file: inline style and script, no CDN). */
public final class DashboardRoute implements Handler {

    public static final String PATH = "/";
    public static final String RESOURCE = "/dashboard/index.html";

    private final byte[] page;

    public DashboardRoute() {
        try (InputStream in = DashboardRoute.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("the dashboard " + RESOURCE + " is missing from the build");
            }
            page = in.readAllBytes();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @Override
    public void handle(Context ctx) {
        ctx.contentType("text/html; charset=utf-8")
                .header("Content-Security-Policy", "default-src 'self'; img-src 'self' blob: data:;"
                        + " style-src 'self' 'unsafe-inline'; script-src 'self' 'unsafe-inline'")
                .result(page);
    }
}
