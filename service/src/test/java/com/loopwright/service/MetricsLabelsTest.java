package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.service.observe.Metrics;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** Label values come from fixed sets: a client cannot mint series by sending made-up method names. */
class MetricsLabelsTest {

    private static final Pattern METHOD_LABEL = Pattern.compile("method=\"([^\"]*)\"");

    @Test
    void madeUpMethodsCountAsOtherAndLaterRealSeriesKeepTheirLabels() throws Exception {
        // Issue 13: 600 requests with unique 7,000-character methods made every scrape 68.9 MB and pushed later
        // real series into route="other".
        int requests = 600;
        try (LiveServer server = LiveServer.start()) {
            for (int i = 0; i < requests; i++) {
                String method = "M" + "X".repeat(6_990) + i;
                try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                    int status = socket.send(
                                    method + " /health HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: close\r\n\r\n")
                            .read()
                            .status();
                    assertTrue(status >= 400 && status < 500, "status " + status);
                }
            }
            assertEquals(200, server.get("/health").status());
            String scrape = server.get("/metrics").text();
            assertTrue(scrape.length() < 64 * 1024, "scrape of " + scrape.length() + " characters");
            Set<String> methods = new HashSet<>();
            Matcher matcher = METHOD_LABEL.matcher(scrape);
            while (matcher.find()) {
                methods.add(matcher.group(1));
            }
            Set<String> allowed = new HashSet<>(Metrics.METHODS);
            allowed.add("other");
            assertTrue(allowed.containsAll(methods), "method labels " + methods);
            PrometheusText metrics = PrometheusText.parse(scrape);
            assertEquals(
                    1,
                    metrics.sum(
                            "loopwright_http_requests_total",
                            Map.of("route", "/health", "method", "GET", "status", "200")),
                    "the real series after the flood");
            assertEquals(requests, metrics.sum("loopwright_http_requests_total", Map.of("method", "other")));
        }
    }
}
