package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The exposition written by the Prometheus Java client: it parses as the text format 0.0.4, holds the standard JVM
 * and process series under their standard names (source: the client's JVM instrumentation, which follows the
 * names of the Prometheus JVM conventions), the build info, both compute histograms, and counts every computing
 * route by outcome. The requests replayed are recorded golden cases (one answered and one refused per route),
 * so that each count is checked against an independently recorded status.
 */
class MetricsExpositionTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final Path CORPUS = Path.of("src", "test", "resources", "golden");
    /** The computing routes and the prefix of the paths that reach them. */
    private static final Map<String, String> COMPUTING_ROUTES = new LinkedHashMap<>();

    static {
        COMPUTING_ROUTES.put("/v1/designs/high-order", "/v1/designs/high-order");
        COMPUTING_ROUTES.put("/v1/designs/batch", "/v1/designs/batch");
        COMPUTING_ROUTES.put("/v1/models/fit", "/v1/models/fit");
        COMPUTING_ROUTES.put("/v1/verifications", "/v1/verifications");
        COMPUTING_ROUTES.put("/v1/designs/plots/{figure}", "/v1/designs/plots/");
        COMPUTING_ROUTES.put("/v1/designs/controllers/{format}", "/v1/designs/controllers/");
        COMPUTING_ROUTES.put("/v1/designs", "/v1/designs");
    }

    private static final List<String> STANDARD_SERIES = List.of(
            "jvm_memory_used_bytes",
            "jvm_memory_committed_bytes",
            "jvm_memory_max_bytes",
            "jvm_threads_current",
            "jvm_gc_collection_seconds_count",
            "jvm_classes_currently_loaded",
            "jvm_runtime_info",
            "process_cpu_seconds_total",
            "process_start_time_seconds",
            "process_resident_memory_bytes");

    @Test
    void standardSeriesBuildInfoAndComputeHistogramsAreExposed() {
        try (LiveServer server = LiveServer.start()) {
            assertEquals(
                    200,
                    server.post("/v1/designs", com.loopwright.examples.DesignClient.INDEXING_AXIS)
                            .status());
            LiveServer.Reply scrape = server.get("/metrics");
            assertEquals("text/plain", scrape.contentType());
            PrometheusText metrics = PrometheusText.parse(scrape.text());
            for (String name : STANDARD_SERIES) {
                assertTrue(metrics.sum(name, Map.of()) > 0, name + " present and positive");
            }
            assertTrue(metrics.sum("jvm_memory_used_bytes", Map.of("area", "heap")) > 0);
            assertEquals(
                    1,
                    metrics.sum(
                            "loopwright_build_info",
                            Map.of("version", ServiceConfig.defaults(0).serviceVersion())));
            assertEquals("histogram", metrics.types.get("loopwright_compute_duration_seconds"));
            assertEquals("histogram", metrics.types.get("loopwright_compute_queue_wait_seconds"));
            assertTrue(metrics.sum("loopwright_compute_duration_seconds_count", Map.of()) >= 1);
            assertTrue(metrics.sum("loopwright_compute_queue_wait_seconds_count", Map.of()) >= 1);
            // A design takes some time on its worker: the compute-time sum is positive.
            assertTrue(metrics.sum("loopwright_compute_duration_seconds_sum", Map.of()) > 0);
        }
    }

    @Test
    void everyComputingRouteIsCountedByOutcome() throws IOException {
        List<JsonNode> cases = new ArrayList<>();
        for (String line : Files.readAllLines(CORPUS.resolve("cases.jsonl"), StandardCharsets.UTF_8)) {
            JsonNode c = JSON.readTree(line);
            if (c.get("server").asText().equals("open")
                    && c.get("method").asText().equals("POST")
                    && c.get("headers").isEmpty()
                    && !c.get("path").asText().equals("/v1/designs/batch")) {
                cases.add(c);
            }
        }
        try (LiveServer server = LiveServer.start()) {
            PrometheusText before = PrometheusText.parse(server.get("/metrics").text());
            for (String route : COMPUTING_ROUTES.keySet()) {
                for (String outcome : Metrics_OUTCOMES) {
                    assertEquals(
                            0,
                            before.sum("loopwright_computations_total", Map.of("route", route, "outcome", outcome)),
                            route + " " + outcome + " exists at zero before any request");
                }
            }
            Map<String, Integer> expectedOk = new LinkedHashMap<>();
            Map<String, Integer> expectedInvalid = new LinkedHashMap<>();
            for (var route : COMPUTING_ROUTES.entrySet()) {
                if (route.getKey().equals("/v1/designs/batch")) {
                    continue;
                }
                int ok = 0;
                int invalid = 0;
                for (JsonNode c : cases) {
                    String path = c.get("path").asText();
                    boolean fits = route.getValue().endsWith("/")
                            ? path.startsWith(route.getValue())
                            : path.equals(route.getValue());
                    if (!fits || (ok >= 1 && invalid >= 1)) {
                        continue;
                    }
                    int recorded = recordedStatus(c.get("id").asText());
                    if ((recorded == 200 && ok == 0) || (recorded == 400 && invalid == 0)) {
                        LiveServer.Reply reply = server.post(
                                path,
                                c.get("body").asText(),
                                c.get("contentType").asText());
                        assertEquals(recorded, reply.status(), c.get("id").asText());
                        ok += recorded == 200 ? 1 : 0;
                        invalid += recorded == 400 ? 1 : 0;
                    }
                }
                assertTrue(ok == 1, "an answered golden case for " + route.getKey());
                expectedOk.put(route.getKey(), ok);
                expectedInvalid.put(route.getKey(), invalid);
            }
            // A batch: one answered item and one invalid one, each counted as a computation of the batch route.
            String items = "{\"items\":[" + com.loopwright.examples.DesignClient.INDEXING_AXIS + ",{}]}";
            assertEquals(200, server.post("/v1/designs/batch", items).status());
            expectedOk.put("/v1/designs/batch", 1);
            expectedInvalid.put("/v1/designs/batch", 1);

            PrometheusText after = PrometheusText.parse(server.get("/metrics").text());
            for (String route : expectedOk.keySet()) {
                assertEquals(
                        (double) expectedOk.get(route),
                        after.sum("loopwright_computations_total", Map.of("route", route, "outcome", "ok")),
                        route + " ok");
                assertEquals(
                        (double) expectedInvalid.get(route),
                        after.sum("loopwright_computations_total", Map.of("route", route, "outcome", "invalid")),
                        route + " invalid");
            }
            // Designs (the single route and batch items) keep their own family with its design outcomes.
            assertEquals(
                    expectedOk.get("/v1/designs") + 1,
                    after.sum("loopwright_designs_total", Map.of("outcome", "designed")));
            assertEquals(
                    expectedInvalid.get("/v1/designs") + 1,
                    after.sum("loopwright_designs_total", Map.of("outcome", "invalid")));
        }
    }

    private static final List<String> Metrics_OUTCOMES =
            List.copyOf(com.loopwright.service.observe.Metrics.COMPUTATION_OUTCOMES);

    private static int recordedStatus(String id) throws IOException {
        String first = Files.readAllLines(CORPUS.resolve("responses").resolve(id + ".txt"), StandardCharsets.UTF_8)
                .get(0);
        return Integer.parseInt(first.substring("status: ".length()).trim());
    }
}
