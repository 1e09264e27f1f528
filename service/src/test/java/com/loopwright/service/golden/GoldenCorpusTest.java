package com.loopwright.service.golden;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.LoopwrightApp;
import com.loopwright.service.ServiceConfig;
import io.javalin.Javalin;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Replays the golden corpus ({@code src/test/resources/golden}) against the live service and compares every
 * response byte for byte: status, Content-Type and body. A refactor must pass it unchanged; an intended change
 * of an answer is recorded again with {@code -Dloopwright.golden.record=true} (see DEVELOPERS.md) and the
 * diff of the recorded files is reviewed like code.
 */
class GoldenCorpusTest {

    /** Where the corpus lives, relative to the service module (surefire's working directory). */
    static final Path CORPUS = Path.of("src", "test", "resources", "golden");

    private static final Path CASES = CORPUS.resolve("cases.jsonl");
    private static final Path RESPONSES = CORPUS.resolve("responses");
    /** The corpus must stay at least this large (every endpoint, form, problem type and batch). */
    static final int MIN_CASES = 300;
    /**
     * Problem types no well-formed HTTP request can provoke deterministically on an idle server (the protocol-level
     * ones are covered on raw sockets by HttpLayerLimitsTest and RawHttpTest).
     */
    private static final Set<ProblemType> NOT_PROVOKABLE = EnumSet.of(
            ProblemType.SERVICE_OVERLOADED,
            ProblemType.DEADLINE_EXCEEDED,
            ProblemType.INTERNAL_ERROR,
            ProblemType.NOT_READY,
            ProblemType.PAYLOAD_TOO_LARGE,
            ProblemType.MALFORMED_HTTP,
            ProblemType.REQUEST_TIMEOUT,
            ProblemType.UNSUPPORTED_PROTOCOL);
    /** Paths of the contract that the corpus does not replay: metrics change with every request. */
    private static final Set<String> NOT_REPLAYED = Set.of("/metrics");
    /**
     * Cases whose body is a file of the repository served byte for byte (the contract and the dashboard page): their
     * expected body is that file as it stands, so that a change of the file itself (a new contract section, a new
     * field on the page) needs no new recording; status and Content-Type are still compared with the recording.
     */
    private static final Map<String, Path> SERVED_FILES = Map.of(
            "get-contract", Path.of("..", "openapi.yaml"),
            "get-dashboard", Path.of("src", "main", "resources", "dashboard", "index.html"));

    private static final ObjectMapper JSON = new ObjectMapper();

    /** The service version the recorded answers state (not the build's, which changes every release). */
    static final String RECORDED_VERSION = "0.0.0-golden";

    private static Javalin open;
    private static Javalin keyed;
    private static final HttpClient HTTP = HttpClient.newBuilder()
            .version(HttpClient.Version.HTTP_1_1)
            .connectTimeout(Duration.ofSeconds(5))
            .build();

    @BeforeAll
    static void start() {
        // A long deadline: a slow CI machine must not turn a recorded 200 into a 504.
        Map<String, String> base = Map.of("LOOPWRIGHT_PORT", "0", "LOOPWRIGHT_COMPUTE_DEADLINE_MS", "120000");
        // A fixed version through the configuration the jar uses, so that the recorded bytes do not change with
        // every release (the version itself comes from the build: ServiceVersionTest).
        open = LoopwrightApp.create(ServiceConfig.fromEnvironment(base).withServiceVersion(RECORDED_VERSION))
                .start("127.0.0.1", 0);
        Map<String, String> withKeys = new LinkedHashMap<>(base);
        withKeys.put("LOOPWRIGHT_API_KEYS", GoldenCase.KEY);
        keyed = LoopwrightApp.create(ServiceConfig.fromEnvironment(withKeys).withServiceVersion(RECORDED_VERSION))
                .start("127.0.0.1", 0);
    }

    @AfterAll
    static void stop() {
        open.stop();
        keyed.stop();
    }

    @Test
    void everyRecordedResponseIsReproducedByteForByte() throws IOException {
        if (Boolean.getBoolean("loopwright.golden.record")) {
            record();
        }
        List<GoldenCase> cases = readCases();
        assertTrue(cases.size() >= MIN_CASES, "the corpus has " + cases.size() + " cases, fewer than " + MIN_CASES);
        List<String> mismatches = new ArrayList<>();
        for (GoldenCase c : cases) {
            Recorded expected = Recorded.parse(Files.readAllBytes(RESPONSES.resolve(c.id() + ".txt")));
            if (SERVED_FILES.containsKey(c.id())) {
                expected = new Recorded(
                        expected.status(), expected.contentType(), Files.readAllBytes(SERVED_FILES.get(c.id())));
            }
            Recorded actual = send(c);
            String difference = expected.difference(actual);
            if (difference != null) {
                mismatches.add(c.id() + ": " + difference);
            }
        }
        assertTrue(
                mismatches.isEmpty(),
                mismatches.size() + " of " + cases.size()
                        + " responses differ from the corpus:\n"
                        + String.join("\n", mismatches.subList(0, Math.min(20, mismatches.size()))));
    }

    @Test
    void corpusCoversEveryPathAndProblemType() throws IOException {
        List<GoldenCase> cases = readCases();
        Set<String> ids = new HashSet<>();
        for (GoldenCase c : cases) {
            assertTrue(ids.add(c.id()), "duplicate case id " + c.id());
        }
        Set<String> uncoveredPaths = new java.util.TreeSet<>();
        for (String template : contractPaths()) {
            Pattern pattern = Pattern.compile(template.replaceAll("\\{[^}]+}", "[^/]+"));
            boolean hit = cases.stream().anyMatch(c -> pattern.matcher(c.path()).matches());
            if (!hit && !NOT_REPLAYED.contains(template)) {
                uncoveredPaths.add(template);
            }
        }
        assertEquals(Set.of(), uncoveredPaths, "contract paths the corpus never requests");
        Set<ProblemType> seen = EnumSet.noneOf(ProblemType.class);
        for (GoldenCase c : cases) {
            String text = new String(Files.readAllBytes(RESPONSES.resolve(c.id() + ".txt")), StandardCharsets.UTF_8);
            for (ProblemType type : ProblemType.values()) {
                if (text.contains("\"" + type.uri() + "\"")) {
                    seen.add(type);
                }
            }
        }
        Set<ProblemType> missing = EnumSet.complementOf(EnumSet.copyOf(seen));
        missing.removeAll(NOT_PROVOKABLE);
        assertEquals(Set.of(), missing, "problem types no recorded response shows");
    }

    /** The path templates openapi.yaml declares (two-space-indented keys under paths). */
    private static List<String> contractPaths() throws IOException {
        List<String> paths = new ArrayList<>();
        Matcher m = Pattern.compile("(?m)^  (/[^:]*):\\s*$").matcher(Files.readString(Path.of("..", "openapi.yaml")));
        while (m.find()) {
            paths.add(m.group(1));
        }
        assertTrue(paths.size() > 5, "openapi.yaml paths found: " + paths);
        return paths;
    }

    /** Writes the case list from {@link GoldenCases} and the responses of the running code. */
    private static void record() throws IOException {
        List<GoldenCase> cases = GoldenCases.all();
        Files.createDirectories(RESPONSES);
        try (var listing = Files.list(RESPONSES)) {
            for (Path old : (Iterable<Path>) listing::iterator) {
                Files.delete(old);
            }
        }
        StringBuilder lines = new StringBuilder();
        for (GoldenCase c : cases) {
            lines.append(JSON.writeValueAsString(toJson(c))).append('\n');
            Files.write(RESPONSES.resolve(c.id() + ".txt"), send(c).bytes());
        }
        Files.writeString(CASES, lines.toString(), StandardCharsets.UTF_8);
    }

    private static ObjectNode toJson(GoldenCase c) {
        ObjectNode node = JSON.createObjectNode();
        node.put("id", c.id())
                .put("server", c.server())
                .put("method", c.method())
                .put("path", c.path());
        node.put("contentType", c.contentType()).put("body", c.body());
        ObjectNode headers = node.putObject("headers");
        new TreeMap<>(c.headers()).forEach(headers::put);
        return node;
    }

    private static List<GoldenCase> readCases() throws IOException {
        List<GoldenCase> cases = new ArrayList<>();
        for (String line : Files.readAllLines(CASES, StandardCharsets.UTF_8)) {
            if (line.isBlank()) {
                continue;
            }
            JsonNode node = JSON.readTree(line);
            Map<String, String> headers = new TreeMap<>();
            node.get("headers")
                    .fields()
                    .forEachRemaining(e -> headers.put(e.getKey(), e.getValue().asText()));
            cases.add(new GoldenCase(
                    node.get("id").asText(),
                    node.get("server").asText(),
                    node.get("method").asText(),
                    node.get("path").asText(),
                    text(node, "contentType"),
                    text(node, "body"),
                    headers));
        }
        return cases;
    }

    private static String text(JsonNode node, String field) {
        JsonNode value = node.get(field);
        return value == null || value.isNull() ? null : value.asText();
    }

    private static Recorded send(GoldenCase c) {
        Javalin server = c.server().equals(GoldenCase.KEYED) ? keyed : open;
        HttpRequest.BodyPublisher body = c.body() == null
                ? HttpRequest.BodyPublishers.noBody()
                : HttpRequest.BodyPublishers.ofString(c.body(), StandardCharsets.UTF_8);
        // A fixed request id per case, so anything derived from it is reproducible too.
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + server.port() + c.path()))
                .timeout(Duration.ofSeconds(120))
                .method(c.method(), body)
                .header("X-Request-Id", "golden-" + c.id());
        if (c.contentType() != null) {
            request.header("Content-Type", c.contentType());
        }
        c.headers().forEach(request::header);
        try {
            HttpResponse<byte[]> response = HTTP.send(request.build(), HttpResponse.BodyHandlers.ofByteArray());
            return new Recorded(
                    response.statusCode(),
                    response.headers().firstValue("Content-Type").orElse(""),
                    response.body());
        } catch (IOException e) {
            throw new UncheckedIOException("case " + c.id() + " failed", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    /** A response as stored: a status line, a content-type line, a blank line, then the body bytes. */
    record Recorded(int status, String contentType, byte[] body) {

        Recorded {
            body = body.clone();
        }

        byte[] bytes() {
            byte[] head =
                    ("status: " + status + "\ncontent-type: " + contentType + "\n\n").getBytes(StandardCharsets.UTF_8);
            byte[] out = new byte[head.length + body.length];
            System.arraycopy(head, 0, out, 0, head.length);
            System.arraycopy(body, 0, out, head.length, body.length);
            return out;
        }

        static Recorded parse(byte[] stored) {
            int first = indexOf(stored, 0);
            int second = indexOf(stored, first + 1);
            String status = new String(stored, 0, first, StandardCharsets.UTF_8);
            String type = new String(stored, first + 1, second - first - 1, StandardCharsets.UTF_8);
            byte[] body = java.util.Arrays.copyOfRange(stored, second + 2, stored.length);
            return new Recorded(
                    Integer.parseInt(status.substring("status: ".length())),
                    type.substring("content-type: ".length()),
                    body);
        }

        private static int indexOf(byte[] bytes, int from) {
            for (int i = from; i < bytes.length; i++) {
                if (bytes[i] == '\n') {
                    return i;
                }
            }
            throw new IllegalArgumentException("recorded response has no header lines");
        }

        /** Null when equal, else where the first difference is. */
        String difference(Recorded actual) {
            if (status != actual.status) {
                return "status " + actual.status + " instead of " + status;
            }
            if (!contentType.equals(actual.contentType)) {
                return "content type " + actual.contentType + " instead of " + contentType;
            }
            int n = Math.min(body.length, actual.body.length);
            for (int i = 0; i < n; i++) {
                if (body[i] != actual.body[i]) {
                    return "body differs at byte " + i + ": ..." + excerpt(actual.body, i) + "... instead of ..."
                            + excerpt(body, i) + "...";
                }
            }
            return body.length == actual.body.length
                    ? null
                    : "body is " + actual.body.length + " bytes instead of " + body.length;
        }

        private static String excerpt(byte[] bytes, int at) {
            int from = Math.max(0, at - 40);
            int to = Math.min(bytes.length, at + 40);
            return new String(bytes, from, to - from, StandardCharsets.UTF_8);
        }
    }
}
