package com.loopwright.bench;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.javalin.Javalin;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * The tools of bench/e2e.sh measure what they claim: the echo floor reads the body and writes the recorded answers
 * in turn with the service's HTTP settings, the in-process baseline designs every e2e scenario, and the reference
 * script designs what Loopwright answers today.
 */
class FloorToolsTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final Path ROOT = Path.of("..");

    @Test
    void echoFloorReadsTheBodyAndAnswersTheRecordedResponsesInTurn() throws Exception {
        byte[] first = "{\"design\":1}".getBytes(StandardCharsets.UTF_8);
        byte[] second = "{\"design\":22}".getBytes(StandardCharsets.UTF_8);
        Javalin floor = EchoFloor.create(List.of(first, second)).start("127.0.0.1", 0);
        try {
            HttpClient client = HttpClient.newHttpClient();
            URI designs = URI.create("http://127.0.0.1:" + floor.port() + EchoFloor.PATH);
            byte[] body = InProcessDesigns.e2eScenarios().get(0);
            for (byte[] expected : List.of(first, second, first)) {
                HttpResponse<byte[]> answer = client.send(post(designs, body), HttpResponse.BodyHandlers.ofByteArray());
                assertEquals(200, answer.statusCode());
                assertEquals(
                        "application/json",
                        answer.headers().firstValue("Content-Type").orElseThrow());
                assertArrayEquals(expected, answer.body());
            }
            // The body is read: an empty one is refused, as the design route refuses it.
            assertEquals(
                    400,
                    client.send(post(designs, new byte[0]), HttpResponse.BodyHandlers.discarding())
                            .statusCode());
            URI health = URI.create("http://127.0.0.1:" + floor.port() + EchoFloor.HEALTH_PATH);
            assertEquals(
                    200,
                    client.send(HttpRequest.newBuilder(health).build(), HttpResponse.BodyHandlers.discarding())
                            .statusCode());
        } finally {
            floor.stop();
        }
        assertThrows(IllegalArgumentException.class, () -> EchoFloor.create(List.of()));
    }

    @Test
    void echoFloorHasTheServiceHttpSettings() throws IOException {
        // source: the service's own defaults (ServiceConfig, HttpLimits); bench does not depend on the service
        // module, so its source is read: a changed service default fails here until the floor follows it.
        String limits = Files.readString(service("http/HttpLimits.java"));
        String config = Files.readString(service("ServiceConfig.java"));
        assertEquals(EchoFloor.HTTP_THREADS, constant(limits, "DEFAULT_HTTP_THREADS"));
        assertEquals(EchoFloor.MIN_HTTP_THREADS, constant(limits, "MIN_HTTP_THREADS"));
        assertEquals(EchoFloor.MAX_HEADER_BYTES, constant(limits, "MAX_HEADER_BYTES"));
        assertEquals(EchoFloor.IDLE_TIMEOUT_MILLIS, constant(limits, "DEFAULT_IDLE_TIMEOUT_MILLIS"));
        assertEquals(EchoFloor.MAX_REQUEST_BYTES, constant(config, "DEFAULT_MAX_REQUEST_BYTES"));
    }

    @Test
    void everyE2eScenarioDesignsAndCertifiesInProcess() throws IOException {
        InProcessDesigns designs = new InProcessDesigns(InProcessDesigns.e2eScenarios());
        assertEquals(6, designs.scenarios());
        for (int i = 0; i < designs.scenarios(); i++) {
            JsonNode answer = JSON.readTree(designs.design(i).text());
            assertTrue(answer.at("/verification/certified").asBoolean(), "scenario " + i);
        }
        // source: the README worked example (gain k [1.57230, 0.0992069]): the first scenario is its request.
        JsonNode readme = JSON.readTree(designs.design(0).text());
        assertEquals(1.57230, readme.at("/gain/k/0").asDouble(), 5e-6);
        assertEquals(0.0992069, readme.at("/gain/k/1").asDouble(), 5e-8);
        // bench/e2e.sh sends the same file's lines.
        assertTrue(Files.readString(ROOT.resolve("bench/e2e.sh"))
                .contains("bench/src/main/resources" + InProcessDesigns.SCENARIOS_RESOURCE));
    }

    @Test
    void inProcessMeasurementCountsDesignsOnEveryThread() throws Exception {
        InProcessDesigns designs = new InProcessDesigns(InProcessDesigns.e2eScenarios());
        // A window of 1 s (not 0.2 s): on a loaded machine a short window can close before the first design does.
        InProcessDesigns.Measurement result = designs.measure(2, 0.2, 1.0);
        assertEquals(2, result.threads());
        assertTrue(result.designs() > 0, "designs " + result.designs());
        assertTrue(result.wallSeconds() >= 1.0 && result.wallSeconds() < 10, "wall " + result.wallSeconds());
        assertTrue(result.cpuSeconds() > 0, "cpu " + result.cpuSeconds());
        // Every counted design wrote a whole answer: between the smallest and the largest of the six.
        int smallest = Integer.MAX_VALUE;
        int largest = 0;
        for (int i = 0; i < designs.scenarios(); i++) {
            int bytes = InProcessDesigns.bodyBytes(designs.design(i));
            smallest = Math.min(smallest, bytes);
            largest = Math.max(largest, bytes);
        }
        double perDesign = result.responseBytes() / (double) result.designs();
        assertTrue(perDesign >= smallest && perDesign <= largest, perDesign + " bytes per design");
        assertTrue(result.resultLine().startsWith("RESULT threads=2 designs=" + result.designs()));
        assertThrows(IllegalArgumentException.class, () -> designs.measure(0, 1, 1));
        assertThrows(IllegalArgumentException.class, () -> designs.measure(InProcessDesigns.MAX_THREADS + 1, 1, 1));
        assertThrows(IllegalArgumentException.class, () -> designs.measure(1, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> designs.measure(1, 1, InProcessDesigns.MAX_SECONDS + 1));
    }

    @Test
    void referenceScriptSolvesTheDesignLoopwrightAnswersToday() throws IOException {
        // The script hard-codes the weights and gamma of Loopwright's answer to the README request (so that it
        // solves the same Riccati equation) and checks its P and gain against Loopwright's; both sets of numbers
        // must be today's answer, to the last digit written.
        String script = Files.readString(ROOT.resolve("bench/reference/design_reference.py"));
        JsonNode readme = JSON.readTree(
                new InProcessDesigns(InProcessDesigns.e2eScenarios()).design(0).text());
        Matcher weights =
                Pattern.compile("RHO1, RHO2 = ([0-9.e-]+), ([0-9.e-]+)").matcher(script);
        assertTrue(weights.find(), "RHO1, RHO2 in the script");
        assertEquals(readme.at("/weights/0").asDouble(), Double.parseDouble(weights.group(1)), 1e-15);
        assertEquals(readme.at("/weights/1").asDouble(), Double.parseDouble(weights.group(2)), 1e-17);
        assertEquals(readme.at("/gamma").asDouble(), number(script, "GAMMA = ([0-9.e-]+)"), 1e-14);
        assertEquals(
                readme.at("/riccati/p/0/0").asDouble(),
                number(script, "LOOPWRIGHT_P = np.array\\(\\[\\[([0-9.e-]+)"),
                1e-15);
        assertEquals(
                readme.at("/gain/k/0").asDouble(), number(script, "LOOPWRIGHT_K = np.array\\(\\[([0-9.e-]+)"), 1e-15);
        assertEquals(
                readme.at("/simulated/riseTime").asDouble(), number(script, "LOOPWRIGHT_RISE_S = ([0-9.e-]+)"), 1e-15);
    }

    private static HttpRequest post(URI uri, byte[] body) {
        return HttpRequest.newBuilder(uri)
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofByteArray(body))
                .build();
    }

    private static Path service(String file) {
        return ROOT.resolve("service/src/main/java/com/loopwright/service").resolve(file);
    }

    private static double number(String text, String regex) {
        Matcher m = Pattern.compile(regex).matcher(text);
        assertTrue(m.find(), regex);
        return Double.parseDouble(m.group(1));
    }

    /** A Java constant's initializer: a literal, a * b or a << b (underscores and the long suffix allowed). */
    private static long constant(String source, String name) {
        Matcher m = Pattern.compile(name + "\\s*=\\s*([^;]+);").matcher(source);
        assertTrue(m.find(), name);
        String expression = m.group(1).replace("_", "").replace("L", "").strip();
        if (expression.contains("<<")) {
            String[] parts = expression.split("<<");
            return Long.parseLong(parts[0].strip()) << Long.parseLong(parts[1].strip());
        }
        if (expression.contains("*")) {
            String[] parts = expression.split("\\*");
            return Long.parseLong(parts[0].strip()) * Long.parseLong(parts[1].strip());
        }
        return Long.parseLong(expression);
    }
}
