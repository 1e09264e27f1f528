package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/**
 * Every metric family of our own that the service exposes is named in README.md's observability section and in
 * the contract's description of GET /metrics, so an operator reading either finds every series a dashboard can
 * plot (common practice: the exposition is part of the contract).
 */
class MetricsDocumentedTest {

    private static final Path README = Path.of("..", "README.md");
    private static final Path CONTRACT = Path.of("..", "openapi.yaml");

    @Test
    void everyFamilyOfOursIsInTheReadmeAndTheContract() throws IOException {
        TreeSet<String> families = new TreeSet<>();
        try (LiveServer server = LiveServer.start()) {
            assertEquals(
                    200,
                    server.post("/v1/designs", com.loopwright.examples.DesignClient.INDEXING_AXIS)
                            .status());
            PrometheusText metrics = PrometheusText.parse(server.get("/metrics").text());
            metrics.types.keySet().stream()
                    .filter(name -> name.startsWith("loopwright_"))
                    .forEach(families::add);
        }
        // The families registered in observe/Metrics: a scrape that lost some would make this test vacuous.
        assertTrue(families.size() >= 10, "families exposed: " + families);
        String readme = Files.readString(README);
        String metricsPath = metricsOperation(Files.readString(CONTRACT));
        List<String> missingInReadme =
                families.stream().filter(name -> !readme.contains(name)).toList();
        List<String> missingInContract =
                families.stream().filter(name -> !metricsPath.contains(name)).toList();
        assertEquals(List.of(), missingInReadme, "families the README does not name");
        assertEquals(List.of(), missingInContract, "families the GET /metrics description does not name");
    }

    /** The text of the /metrics path item, up to the next path. */
    private static String metricsOperation(String contract) {
        int start = contract.indexOf("\n  /metrics:");
        assertTrue(start >= 0, "openapi.yaml has a /metrics path");
        int end = contract.indexOf("\n  /", start + 1);
        return contract.substring(start, end < 0 ? contract.length() : end);
    }
}
