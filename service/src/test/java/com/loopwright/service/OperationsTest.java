package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.examples.DesignClient;
import java.net.http.HttpRequest;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Security, request ids, probes, metrics and the batch endpoint on the real server. */
class OperationsTest {

    private static final String KEY = "indexing-axis-key-0001";
    private static final String OTHER_KEY = "gimbal-dashboard-key-0002";
    private static final String GIMBAL = """
            {"plant":{"form":"canonical","a0":0,"a1":2,"b":150,"d":60},"spec":{"settlingTime":0.3,"overshootPercent":1}}""";

    private static ServiceConfig config(Map<String, String> environment) {
        Map<String, String> env = new java.util.HashMap<>(environment);
        env.put("LOOPWRIGHT_PORT", "0");
        return ServiceConfig.fromEnvironment(env);
    }

    private static HttpRequest.Builder post(LiveServer server, String path, String body) {
        return HttpRequest.newBuilder(server.base().resolve(path))
                .timeout(Duration.ofSeconds(30))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(body));
    }

    @Test
    void withoutKeysConfiguredNoCredentialIsNeeded() {
        try (LiveServer server = LiveServer.start()) {
            assertEquals(
                    200, server.post("/v1/designs", DesignClient.INDEXING_AXIS).status());
        }
    }

    @Test
    void apiKeysAreRequiredAndComparedWhenConfigured() {
        try (LiveServer server = LiveServer.start(config(Map.of("LOOPWRIGHT_API_KEYS", KEY + "," + OTHER_KEY)))) {
            var missing = server.post("/v1/designs", DesignClient.INDEXING_AXIS);
            assertEquals(401, missing.status());
            assertEquals(
                    "tag:loopwright.dev,2026:problem/unauthorized",
                    missing.json().get("type").asText());
            assertTrue(missing.header("WWW-Authenticate").startsWith("Bearer"));
            var wrong = server.send(
                    post(server, "/v1/designs", DesignClient.INDEXING_AXIS)
                            .header("Authorization", "Bearer " + KEY + "x")
                            .build(),
                    "/v1/designs",
                    "post");
            assertEquals(403, wrong.status());
            assertFalse(wrong.text().contains(KEY), "keys are never echoed");
            var bearer = server.send(
                    post(server, "/v1/designs", DesignClient.INDEXING_AXIS)
                            .header("Authorization", "Bearer " + KEY)
                            .build(),
                    "/v1/designs",
                    "post");
            assertEquals(200, bearer.status(), bearer.text());
            var header = server.send(
                    post(server, "/v1/designs/batch", "{\"items\":[" + GIMBAL + "]}")
                            .header("X-Api-Key", OTHER_KEY)
                            .build(),
                    "/v1/designs/batch",
                    "post");
            assertEquals(200, header.status(), header.text());
            var batchWithout = server.post("/v1/designs/batch", "{\"items\":[" + GIMBAL + "]}");
            assertEquals(401, batchWithout.status());
            // Probes, metrics and the contract stay open for the orchestrator and the scraper.
            assertEquals(200, server.get("/health/ready").status());
            assertEquals(200, server.get("/metrics").status());
            assertEquals(200, server.get("/openapi.yaml").status());
        }
    }

    @Test
    void apiKeysAreReadFromAFileAndMaskedInTheConfiguration(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
            throws Exception {
        java.nio.file.Path file = dir.resolve("keys");
        java.nio.file.Files.writeString(file, "# tank-level dashboard\n" + KEY + "\n\n");
        ServiceConfig config = config(Map.of("LOOPWRIGHT_API_KEYS_FILE", file.toString()));
        assertEquals(List.of(KEY), config.apiKeys());
        assertFalse(config.toString().contains(KEY), config.toString());
        assertFalse(config.describe().toString().contains(KEY));
        assertTrue(config.describe().get("LOOPWRIGHT_API_KEYS").contains("1 key"));
    }

    @Test
    void corsIsOffByDefaultAndAllowsOnlyListedOrigins() {
        String origin = "https://scada.plant.example:8443";
        try (LiveServer off = LiveServer.start()) {
            var reply = off.send(
                    post(off, "/v1/designs", DesignClient.INDEXING_AXIS)
                            .header("Origin", origin)
                            .build(),
                    "/v1/designs",
                    "post");
            assertEquals(200, reply.status());
            assertNull(reply.header("Access-Control-Allow-Origin"));
            var preflight = off.send(
                    HttpRequest.newBuilder(off.base().resolve("/v1/designs"))
                            .method("OPTIONS", HttpRequest.BodyPublishers.noBody())
                            .header("Origin", origin)
                            .header("Access-Control-Request-Method", "POST")
                            .build(),
                    "/v1/designs",
                    "options");
            assertNull(preflight.header("Access-Control-Allow-Origin"));
            assertTrue(preflight.status() >= 400, "no preflight when CORS is off: " + preflight.status());
        }
        try (LiveServer on = LiveServer.start(config(Map.of("LOOPWRIGHT_CORS_ORIGINS", origin)))) {
            var preflight = on.send(
                    HttpRequest.newBuilder(on.base().resolve("/v1/designs"))
                            .method("OPTIONS", HttpRequest.BodyPublishers.noBody())
                            .header("Origin", origin)
                            .header("Access-Control-Request-Method", "POST")
                            .header("Access-Control-Request-Headers", "content-type, x-api-key")
                            .build(),
                    "/v1/designs",
                    "options");
            assertEquals(204, preflight.status());
            assertEquals(origin, preflight.header("Access-Control-Allow-Origin"));
            assertTrue(preflight.header("Access-Control-Allow-Methods").contains("POST"));
            assertTrue(preflight.header("Access-Control-Allow-Headers").contains("X-Api-Key"));
            var stranger = on.send(
                    HttpRequest.newBuilder(on.base().resolve("/v1/designs"))
                            .method("OPTIONS", HttpRequest.BodyPublishers.noBody())
                            .header("Origin", "https://evil.example")
                            .header("Access-Control-Request-Method", "POST")
                            .build(),
                    "/v1/designs",
                    "options");
            assertEquals(403, stranger.status());
            assertNull(stranger.header("Access-Control-Allow-Origin"));
            var simple = on.send(
                    post(on, "/v1/designs", DesignClient.INDEXING_AXIS)
                            .header("Origin", origin)
                            .build(),
                    "/v1/designs",
                    "post");
            assertEquals(origin, simple.header("Access-Control-Allow-Origin"));
            assertEquals("Origin", simple.header("Vary"));
        }
    }

    @Test
    void requestIdsAreEchoedOrIssuedAndSecurityHeadersAreSet() {
        try (LiveServer server = LiveServer.start()) {
            var echoed = server.send(
                    HttpRequest.newBuilder(server.base().resolve("/health"))
                            .header("X-Request-Id", "conveyor-42.a_b:c")
                            .build(),
                    "/health",
                    "get");
            assertEquals("conveyor-42.a_b:c", echoed.header("X-Request-Id"));
            var issued = server.get("/health");
            assertTrue(issued.header("X-Request-Id").matches("[0-9a-f-]{36}"), issued.header("X-Request-Id"));
            var unsafe = server.send(
                    HttpRequest.newBuilder(server.base().resolve("/health"))
                            .header("X-Request-Id", "x".repeat(200))
                            .build(),
                    "/health",
                    "get");
            assertTrue(unsafe.header("X-Request-Id").matches("[0-9a-f-]{36}"), "an over-long id is replaced");
            var problem = server.get("/nowhere");
            assertNotNull(problem.header("X-Request-Id"), "errors carry the id too");
            for (var reply : List.of(issued, problem)) {
                assertEquals("nosniff", reply.header("X-Content-Type-Options"));
                assertEquals("DENY", reply.header("X-Frame-Options"));
                assertEquals("no-store", reply.header("Cache-Control"));
                assertTrue(reply.header("Content-Security-Policy").contains("default-src 'none'"));
            }
        }
    }

    @Test
    void probesAnswer() {
        try (LiveServer server = LiveServer.start()) {
            assertEquals("up", server.get("/health/live").json().get("status").asText());
            assertEquals("up", server.get("/health/ready").json().get("status").asText());
            assertEquals("up", server.get("/health").json().get("status").asText());
        }
    }

    @Test
    void metricsParseAndCountRequestsAndDesignsByOutcome() {
        try (LiveServer server = LiveServer.start()) {
            for (int i = 0; i < 3; i++) {
                assertEquals(
                        200,
                        server.post("/v1/designs", DesignClient.INDEXING_AXIS).status());
            }
            assertEquals(400, server.post("/v1/designs", "{}").status());
            assertEquals(
                    422,
                    server.post("/v1/designs", DesignClient.INDEXING_AXIS.replace("1.5}", "10}"))
                            .status());
            server.get("/nowhere");
            var scrape = server.get("/metrics");
            assertEquals(200, scrape.status());
            assertTrue(scrape.contentType().equals("text/plain"), scrape.contentType());
            PrometheusText metrics = PrometheusText.parse(scrape.text());
            assertEquals("histogram", metrics.types.get("loopwright_http_request_duration_seconds"));
            assertEquals(
                    3,
                    metrics.sum(
                            "loopwright_http_requests_total",
                            Map.of("route", "/v1/designs", "method", "POST", "status", "200")));
            assertEquals(
                    3,
                    metrics.sum(
                            "loopwright_http_request_duration_seconds_count",
                            Map.of("route", "/v1/designs", "status", "200")));
            assertEquals(1, metrics.sum("loopwright_http_requests_total", Map.of("route", "other", "status", "404")));
            assertEquals(3, metrics.sum("loopwright_designs_total", Map.of("outcome", "designed")));
            assertEquals(1, metrics.sum("loopwright_designs_total", Map.of("outcome", "invalid")));
            assertEquals(1, metrics.sum("loopwright_designs_total", Map.of("outcome", "infeasible")));
            assertTrue(metrics.sum("jvm_memory_used_bytes", Map.of("area", "heap")) > 0);
            assertTrue(metrics.sum("jvm_threads_current", Map.of()) > 0);
            // In flight during a scrape: the scrape itself (the previous request's count lands just after its
            // response, so look again briefly).
            double inFlight = metrics.sum("loopwright_http_requests_in_flight", Map.of());
            for (int i = 0; i < 50 && inFlight != 1; i++) {
                inFlight = PrometheusText.parse(server.get("/metrics").text())
                        .sum("loopwright_http_requests_in_flight", Map.of());
            }
            assertEquals(1, inFlight, "only the scrape itself");
        }
    }

    @Test
    void batchStreamsOneLinePerItemInOrderAndEqualsSingleDesigns() {
        try (LiveServer server = LiveServer.start()) {
            String infeasible = DesignClient.INDEXING_AXIS.replace("1.5}", "10}");
            String items = String.join(",", DesignClient.INDEXING_AXIS, "{\"plant\":{}}", GIMBAL, infeasible);
            var reply = server.post("/v1/designs/batch", "{\"items\":[" + items + "]}");
            assertEquals(200, reply.status(), reply.text());
            assertEquals("application/x-ndjson", reply.contentType());
            List<JsonNode> lines = reply.lines();
            assertEquals(4, lines.size());
            int[] statuses = {200, 400, 200, 422};
            String[] singles = {DesignClient.INDEXING_AXIS, "{\"plant\":{}}", GIMBAL, infeasible};
            for (int i = 0; i < 4; i++) {
                assertEquals(i, lines.get(i).get("index").asInt());
                assertEquals(statuses[i], lines.get(i).get("status").asInt());
                var single = server.post("/v1/designs", singles[i]);
                assertEquals(single.status(), lines.get(i).get("status").asInt());
                if (single.status() == 200) {
                    assertEquals(single.json(), lines.get(i).get("design"), "batch item = single design");
                } else {
                    JsonNode problem = lines.get(i).get("problem");
                    assertEquals(single.json().get("type"), problem.get("type"));
                    assertEquals(single.json().get("errors"), problem.get("errors"));
                    assertEquals(
                            "/requests/"
                                    + reply.headers().firstValue("X-Request-Id").orElseThrow() + "#/items/" + i,
                            problem.get("instance").asText());
                }
            }
        }
    }

    @Test
    void malformedBatchEnvelopesAreProblems() {
        try (LiveServer server = LiveServer.start(config(Map.of("LOOPWRIGHT_MAX_BATCH_ITEMS", "3")))) {
            String one = DesignClient.INDEXING_AXIS;
            Map<String, String> bodies = Map.of(
                    "not JSON", "{items:",
                    "array", "[" + one + "]",
                    "no items", "{}",
                    "items not an array", "{\"items\":{}}",
                    "empty items", "{\"items\":[]}",
                    "over the cap", "{\"items\":[" + String.join(",", one, one, one, one) + "]}",
                    "unknown member", "{\"items\":[" + one + "],\"priority\":1}",
                    "duplicate items", "{\"items\":[" + one + "],\"items\":[]}",
                    "trailing garbage", "{\"items\":[" + one + "]} x");
            bodies.forEach((name, body) -> {
                var reply = server.post("/v1/designs/batch", body);
                assertEquals(400, reply.status(), name + ": " + reply.text());
                assertEquals("application/problem+json", reply.contentType(), name);
            });
            assertEquals(
                    415,
                    server.post("/v1/designs/batch", "{\"items\":[" + one + "]}", "text/plain")
                            .status());
            var cap = server.post("/v1/designs/batch", "{\"items\":[" + String.join(",", one, one, one, one) + "]}");
            assertEquals("/items", cap.json().at("/errors/0/pointer").asText());
        }
    }
}
