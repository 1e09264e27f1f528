package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.read.ListAppender;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slf4j.LoggerFactory;

/**
 * Requests the HTTP layer refuses before the application sees them (413, 408, 503, 400) are counted in
 * loopwright_http_requests_total like any other, once each, with the route template as label (bounded: a path
 * that fits no route is "other", a made-up method "other").
 */
class GateRefusalMetricsTest {

    private static final String REQUESTS = "loopwright_http_requests_total";
    private static final int CAP_BYTES = 1 << 20;

    private static LiveServer start(Map<String, String> settings) {
        Map<String, String> environment = new HashMap<>(settings);
        environment.put("LOOPWRIGHT_PORT", "0");
        environment.put("LOOPWRIGHT_MAX_REQUEST_BYTES", String.valueOf(CAP_BYTES));
        environment.put("LOOPWRIGHT_MAX_INFLIGHT_BODY_BYTES", String.valueOf(CAP_BYTES));
        return LiveServer.start(ServiceConfig.fromEnvironment(environment));
    }

    private static String head(String method, String path, String headers) {
        return method + " " + path + " HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\n" + headers
                + "\r\n";
    }

    /** The count of one series, polled briefly (a count lands just after its response). */
    private static double count(LiveServer server, String route, String method, String status, double expected)
            throws InterruptedException {
        double seen = -1;
        for (int attempt = 0; attempt < 50 && seen != expected; attempt++) {
            Thread.sleep(attempt == 0 ? 0 : 20);
            seen = PrometheusText.parse(server.get("/metrics").text())
                    .sum(REQUESTS, Map.of("route", route, "method", method, "status", status));
        }
        return seen;
    }

    @Test
    void bodiesOverTheCapAreCountedOnceWithTheirRoute() throws Exception {
        try (LiveServer server = start(Map.of())) {
            // Answered at once (Expect: 100-continue) on a plain path and on a templated one.
            try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                assertEquals(
                        413,
                        socket.send(head(
                                        "POST",
                                        "/v1/designs",
                                        "Content-Length: " + (CAP_BYTES + 1) + "\r\nExpect: 100-continue\r\n"))
                                .read()
                                .status());
            }
            try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                assertEquals(
                        413,
                        socket.send(head(
                                        "POST",
                                        "/v1/designs/plots/bode",
                                        "Content-Length: " + (CAP_BYTES + 1) + "\r\nExpect: 100-continue\r\n"))
                                .read()
                                .status());
            }
            // Read and dropped first, then answered: still one count.
            byte[] body = new byte[CAP_BYTES + 10];
            java.util.Arrays.fill(body, (byte) ' ');
            try (RawExchange socket = new RawExchange(server.app().port(), 10_000)) {
                socket.send(head("POST", "/v1/verifications", "Content-Length: " + body.length + "\r\n"));
                assertEquals(413, socket.send(body).read().status());
            }
            // A path that fits no route and a made-up method: the bounded label "other".
            try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                assertEquals(
                        413,
                        socket.send(head(
                                        "BREW",
                                        "/no/such/" + "x".repeat(40),
                                        "Content-Length: " + (CAP_BYTES + 1) + "\r\nExpect: 100-continue\r\n"))
                                .read()
                                .status());
            }
            assertEquals(1, count(server, "/v1/designs", "POST", "413", 1));
            assertEquals(1, count(server, "/v1/designs/plots/{figure}", "POST", "413", 1));
            assertEquals(1, count(server, "/v1/verifications", "POST", "413", 1));
            assertEquals(1, count(server, "other", "other", "413", 1));
        }
    }

    @Test
    void slowBrokenAndOverBudgetBodiesAreCounted() throws Exception {
        try (LiveServer server =
                start(Map.of("LOOPWRIGHT_BODY_GRACE_MS", "300", "LOOPWRIGHT_MIN_BODY_BYTES_PER_S", "1000"))) {
            try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                assertEquals(
                        408,
                        socket.send(head("POST", "/v1/designs/batch", "Content-Length: 100\r\n") + "{")
                                .read()
                                .status());
            }
            try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                assertEquals(
                        400,
                        socket.send(head("POST", "/v1/models/fit", "Transfer-Encoding: chunked\r\n") + "ZZ\r\nabc\r\n")
                                .read()
                                .status());
            }
            // One body of the whole budget half sent; the next body is refused for the budget.
            try (RawExchange holder = new RawExchange(server.app().port(), 5_000);
                    RawExchange refused = new RawExchange(server.app().port(), 5_000)) {
                holder.send(head("POST", "/v1/designs", "Content-Length: " + CAP_BYTES + "\r\n") + "{");
                Thread.sleep(100);
                assertEquals(
                        503,
                        refused.send(head(
                                        "POST",
                                        "/v1/designs/high-order",
                                        "Content-Length: 10\r\nExpect: 100-continue\r\n"))
                                .read()
                                .status());
            }
            assertEquals(1, count(server, "/v1/designs/batch", "POST", "408", 1));
            assertEquals(1, count(server, "/v1/models/fit", "POST", "400", 1));
            assertEquals(1, count(server, "/v1/designs/high-order", "POST", "503", 1));
        }
    }

    @Test
    void aRefusalWritesOneAccessLineLikeAnyRequest() throws Exception {
        Logger access = (Logger) LoggerFactory.getLogger("com.loopwright.access");
        ListAppender<ILoggingEvent> captured = new ListAppender<>();
        captured.start();
        Level before = access.getLevel();
        access.setLevel(Level.INFO);
        access.addAppender(captured);
        try (LiveServer server = start(Map.of());
                RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
            assertEquals(
                    413,
                    socket.send(head(
                                    "POST",
                                    "/v1/designs/plots/bode",
                                    "Content-Length: " + (CAP_BYTES + 1) + "\r\nExpect: 100-continue\r\n"))
                            .read()
                            .status());
        } finally {
            access.detachAppender(captured);
            access.setLevel(before);
        }
        assertEquals(1, captured.list.size(), captured.list.toString());
        String line = captured.list.get(0).getFormattedMessage();
        assertTrue(line.matches("POST /v1/designs/plots/\\{figure} 413 [0-9.]+ ms"), line);
    }
}
