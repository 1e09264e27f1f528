package com.loopwright.service.routes;

import com.loopwright.service.observe.Metrics;
import io.javalin.http.Context;
import io.javalin.http.Handler;

/** GET /metrics: the Prometheus text exposition (format 0.0.4) of the service's registry. */
public final class MetricsRoute implements Handler {

    public static final String PATH = "/metrics";

    private final Metrics metrics;

    public MetricsRoute(Metrics metrics) {
        this.metrics = metrics;
    }

    @Override
    public void handle(Context ctx) {
        ctx.contentType(Metrics.CONTENT_TYPE).result(metrics.scrape());
    }
}
