package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.problem.ProblemType;
import com.loopwright.examples.DesignClient;
import java.net.http.HttpRequest;
import java.time.Duration;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * On a keyed route the API key is checked from the headers before the HTTP layer admits a body: a client without
 * an accepted key reserves none of the in-flight body budget, so it cannot crowd out clients that have one.
 */
class KeyBeforeBodyTest {

    private static final String KEY = "indexing-axis-key-0001";
    /** The request cap and the whole body budget: one body of the cap spends all of it. */
    private static final int BUDGET_BYTES = 1 << 20;

    private static final String BUDGET_GAUGE = "loopwright_http_body_budget_available_bytes";
    /** How long the budget is watched while an unauthenticated body is half sent [ms]. */
    private static final int WATCH_MILLIS = 400;

    private static LiveServer keyedServer() {
        Map<String, String> environment = new HashMap<>();
        environment.put("LOOPWRIGHT_PORT", "0");
        environment.put("LOOPWRIGHT_API_KEYS", KEY);
        environment.put("LOOPWRIGHT_MAX_REQUEST_BYTES", String.valueOf(BUDGET_BYTES));
        environment.put("LOOPWRIGHT_MAX_INFLIGHT_BODY_BYTES", String.valueOf(BUDGET_BYTES));
        environment.put("LOOPWRIGHT_BODY_GRACE_MS", "60000");
        return LiveServer.start(ServiceConfig.fromEnvironment(environment));
    }

    private static String head(String path, String headers) {
        return "POST " + path + " HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\n" + headers + "\r\n";
    }

    private static double availableBudget(LiveServer server) {
        return PrometheusText.parse(server.get("/metrics").text()).sum(BUDGET_GAUGE, Map.of());
    }

    @Test
    void anUnauthenticatedBodyReservesNoBudgetAndGets401WhenItHasArrived() throws Exception {
        try (LiveServer server = keyedServer();
                RawExchange intruder = new RawExchange(server.app().port(), 10_000)) {
            // A body of the whole budget, its first kilobyte sent, the rest held back.
            byte[] body = new byte[BUDGET_BYTES];
            java.util.Arrays.fill(body, (byte) ' ');
            intruder.send(head("/v1/designs/batch", "Content-Length: " + BUDGET_BYTES + "\r\n"));
            intruder.send(java.util.Arrays.copyOfRange(body, 0, 1024));
            long end = System.nanoTime() + Duration.ofMillis(WATCH_MILLIS).toNanos();
            while (System.nanoTime() < end) {
                assertEquals(BUDGET_BYTES, availableBudget(server), "budget while the unauthenticated body arrives");
                Thread.sleep(50);
            }
            // A client with the key is admitted meanwhile (before the fix: 503, the budget was spent).
            var admitted = server.send(
                    HttpRequest.newBuilder(server.base().resolve("/v1/designs"))
                            .timeout(Duration.ofSeconds(30))
                            .header("Content-Type", "application/json")
                            .header("X-Api-Key", KEY)
                            .POST(HttpRequest.BodyPublishers.ofString(DesignClient.INDEXING_AXIS))
                            .build(),
                    "/v1/designs",
                    "post");
            assertEquals(200, admitted.status(), admitted.text());
            assertFalse(intruder.hasReply(), "the unauthenticated body is not answered before it has arrived");
            intruder.send(java.util.Arrays.copyOfRange(body, 1024, BUDGET_BYTES));
            RawExchange.Reply refused = intruder.read();
            assertEquals(401, refused.status(), refused.body());
            assertEquals(
                    ProblemType.UNAUTHORIZED.uri(), refused.json().get("type").asText());
            assertTrue(
                    refused.header("WWW-Authenticate").startsWith("Bearer"),
                    refused.headers().toString());
            // The body was read and dropped, so the connection carries the next request.
            RawExchange.Reply health = intruder.send("GET /health HTTP/1.1\r\nHost: 127.0.0.1\r\n\r\n")
                    .read();
            assertEquals(200, health.status());
            assertEquals(BUDGET_BYTES, availableBudget(server));
        }
    }

    @Test
    void aWrongKeyGets403AndReservesNothingEither() throws Exception {
        try (LiveServer server = keyedServer();
                RawExchange socket = new RawExchange(server.app().port(), 10_000)) {
            String body = DesignClient.INDEXING_AXIS;
            socket.send(
                    head("/v1/designs", "X-Api-Key: not-the-key-0000000\r\nContent-Length: " + body.length() + "\r\n"));
            socket.send(body.substring(0, 10));
            Thread.sleep(100);
            assertEquals(BUDGET_BYTES, availableBudget(server));
            RawExchange.Reply reply = socket.send(body.substring(10)).read();
            assertEquals(403, reply.status(), reply.body());
            assertEquals(ProblemType.FORBIDDEN.uri(), reply.json().get("type").asText());
        }
    }

    @Test
    void withoutAKeyExpectContinueAndBodiesOverTheCapGet401AtOnceAndTheConnectionCloses() throws Exception {
        try (LiveServer server = keyedServer()) {
            String[] headers = {
                "Content-Length: 5000\r\nExpect: 100-continue\r\n",
                // Over the cap: 401, not 413, because the key is checked first and the size tells nothing.
                "Content-Length: " + (8L * BUDGET_BYTES) + "\r\n",
            };
            for (String header : headers) {
                try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                    RawExchange.Reply reply =
                            socket.send(head("/v1/designs", header)).read();
                    assertEquals(401, reply.status(), header + reply.body());
                    assertEquals("close", reply.header("Connection"), header);
                }
            }
            assertEquals(BUDGET_BYTES, availableBudget(server));
            // The same request with the key is admitted as before.
            try (RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
                RawExchange.Reply reply = socket.send(head(
                                "/v1/designs",
                                "X-Api-Key: " + KEY + "\r\nContent-Length: 5000\r\nExpect: 100-continue\r\n"))
                        .read();
                assertEquals(100, reply.status(), reply.toString());
            }
        }
    }

    @Test
    void aChunkedBodyWithoutAKeyIsDroppedOnlyUpToTheDrainBoundThenCut() throws Exception {
        // One chunk announced at 8 request caps; 4 caps (the drain bound) and 64 KiB of it sent, then nothing more.
        int sent = 4 * BUDGET_BYTES + (64 << 10);
        byte[] part = new byte[sent];
        java.util.Arrays.fill(part, (byte) ' ');
        try (LiveServer server = keyedServer();
                RawExchange socket = new RawExchange(server.app().port(), 10_000)) {
            socket.send(head("/v1/designs", "Transfer-Encoding: chunked\r\n") + Integer.toHexString(8 * BUDGET_BYTES)
                    + "\r\n");
            RawExchange.Reply reply = socket.send(part).read();
            assertEquals(401, reply.status(), reply.body());
            assertEquals("close", reply.header("Connection"));
            assertEquals(-1, socket.in().read(), "the connection is closed after the answer");
            assertEquals(BUDGET_BYTES, availableBudget(server));
        }
    }

    @Test
    void aRequestWithTheKeyStillReservesItsBodyAsBefore() throws Exception {
        try (LiveServer server = keyedServer();
                RawExchange socket = new RawExchange(server.app().port(), 10_000)) {
            // With the key, a half-sent body holds its reservation, as every admitted body does.
            socket.send(head("/v1/designs", "Authorization: Bearer " + KEY + "\r\nContent-Length: 1000\r\n") + "{");
            double available = BUDGET_BYTES;
            for (int i = 0; i < 50 && available == BUDGET_BYTES; i++) {
                Thread.sleep(20);
                available = availableBudget(server);
            }
            assertEquals(BUDGET_BYTES - 1000, available);
        }
    }
}
