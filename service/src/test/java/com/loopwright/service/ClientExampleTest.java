package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.examples.DesignClient;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The bare-JDK client example against a live service with API keys: it sends its key, and its problem printout
 * carries what the problem says (read independently with Jackson): status, title, detail, every field error and
 * every proposal.
 */
class ClientExampleTest {

    private static final String KEY = "client-example-key-0001";
    /** Overshoot far above what a plant without stiffness can take with this method (the dashboard's example). */
    private static final String INFEASIBLE = """
            {"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":30}}""";

    @Test
    void sendsItsKeyAndPrintsEveryPartOfAProblem() throws Exception {
        try (LiveServer server = LiveServer.start(
                ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_PORT", "0", "LOOPWRIGHT_API_KEYS", KEY)))) {
            assertTrue(new DesignClient(server.base(), KEY)
                    .design(DesignClient.INDEXING_AXIS)
                    .certified());

            DesignClient.Reply refused = new DesignClient(server.base()).design(DesignClient.INDEXING_AXIS);
            assertEquals(401, refused.status());
            assertTrue(
                    printed(refused).startsWith("HTTP 401 Unauthorized: this service requires an API key"),
                    printed(refused));
            assertEquals(
                    403,
                    new DesignClient(server.base(), "not-the-configured-key")
                            .design(DesignClient.INDEXING_AXIS)
                            .status());

            DesignClient.Reply infeasible = new DesignClient(server.base(), KEY).design(INFEASIBLE);
            assertEquals(422, infeasible.status());
            JsonNode problem = new ObjectMapper().readTree(infeasible.body());
            String text = printed(infeasible);
            assertTrue(
                    text.startsWith("HTTP 422 " + problem.get("title").asText() + ": "
                            + problem.get("detail").asText() + "\n"),
                    text);
            assertTrue(
                    problem.get("errors").size() > 0 && problem.get("proposals").size() > 0, infeasible.body());
            for (JsonNode error : problem.get("errors")) {
                assertTrue(
                        text.contains("  field " + error.get("pointer").asText() + ": "
                                + error.get("detail").asText() + "\n"),
                        text);
            }
            for (JsonNode proposal : problem.get("proposals")) {
                assertTrue(
                        text.contains("  proposal " + proposal.get("pointer").asText() + " = "
                                + proposal.get("value").asText()),
                        text);
            }
        }
    }

    @Test
    void retryAfterIsReadInSecondsAndCapped() {
        assertEquals(1, DesignClient.retryAfterSeconds("1"));
        assertEquals(7, DesignClient.retryAfterSeconds(" 7 "));
        assertEquals(DesignClient.MAX_WAIT_SECONDS, DesignClient.retryAfterSeconds("120"));
        assertEquals(DesignClient.MAX_WAIT_SECONDS, DesignClient.retryAfterSeconds("999999999"));
        assertEquals(DesignClient.MAX_WAIT_SECONDS, DesignClient.retryAfterSeconds("99999999999999999999"));
        // an HTTP date (RFC 9110 allows it) or no header: the client waits one second
        assertEquals(1, DesignClient.retryAfterSeconds("Wed, 21 Oct 2026 07:28:00 GMT"));
        assertEquals(1, DesignClient.retryAfterSeconds(null));
    }

    private static String printed(DesignClient.Reply reply) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (PrintStream out = new PrintStream(bytes, true, StandardCharsets.UTF_8)) {
            DesignClient.printProblem(reply, out);
        }
        return bytes.toString(StandardCharsets.UTF_8);
    }
}
