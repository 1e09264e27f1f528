package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.ProblemType;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.function.Function;
import org.junit.jupiter.api.Test;

/**
 * The response examples of openapi.yaml (issue 15): every 200 of every operation has one for each of its media types,
 * the main problems (400, 401, 404, 405, 413, 422, 503) have one, every JSON example validates against its schema
 * (JSON Schema 2020-12, networknt validator), and every example is an answer the started service gives: a JSON
 * example has the same members at the same places as the live answer to the request example of the same name (or to
 * the request its problem example names), a text example is the live answer with its numbers masked, and the
 * Prometheus, contract and page examples are excerpts of the live text.
 *
 * <p>Run with {@code -Dloopwright.examples.write=DIR} to write each live answer to DIR (how the examples were made).
 */
class ContractExamplesTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final String PROBLEM_JSON = "application/problem+json";
    /** The problems every /v1 operation documents with an example; 404 where the path takes a name. */
    private static final List<String> MAIN_PROBLEMS = List.of("400", "401", "405", "413", "422", "503");

    private final Contract contract = Contract.load();

    /** Each operation: path template, method, operation node. */
    private List<String[]> operations() {
        List<String[]> found = new ArrayList<>();
        contract.document()
                .get("paths")
                .fields()
                .forEachRemaining(path -> path.getValue()
                        .fieldNames()
                        .forEachRemaining(method -> found.add(new String[] {path.getKey(), method})));
        return found;
    }

    private JsonNode operation(String[] op) {
        return contract.document().get("paths").get(op[0]).get(op[1]);
    }

    /** A response object, through its $ref into components/responses. */
    private JsonNode response(JsonNode operation, String status) {
        JsonNode response = operation.path("responses").path(status);
        JsonNode ref = response.get("$ref");
        return ref == null ? response : contract.document().at(ref.asText().substring(1));
    }

    /** The examples of one media type: name to value, through $refs into components/examples. */
    private Map<String, JsonNode> examples(JsonNode media) {
        Map<String, JsonNode> found = new java.util.LinkedHashMap<>();
        if (media.has("example")) {
            found.put("example", media.get("example"));
        }
        media.path("examples").fields().forEachRemaining(e -> {
            JsonNode ref = e.getValue().get("$ref");
            JsonNode example = ref == null
                    ? e.getValue()
                    : contract.document().at(ref.asText().substring(1));
            found.put(e.getKey(), example.get("value"));
        });
        return found;
    }

    @Test
    void every200OfEveryOperationHasAnExampleForEachMediaType() {
        List<String> missing = new ArrayList<>();
        for (String[] op : operations()) {
            JsonNode content = response(operation(op), "200").path("content");
            assertTrue(content.size() > 0, op[1] + " " + op[0] + " documents its 200 body");
            content.fields().forEachRemaining(media -> {
                if (examples(media.getValue()).isEmpty()) {
                    missing.add(op[1] + " " + op[0] + " 200 " + media.getKey());
                }
            });
        }
        assertEquals(List.of(), missing);
    }

    @Test
    void theMainProblemsHaveExamples() {
        List<String> missing = new ArrayList<>();
        for (String[] op : operations()) {
            if (!op[0].startsWith("/v1/")) {
                continue;
            }
            JsonNode operation = operation(op);
            List<String> statuses = new ArrayList<>(MAIN_PROBLEMS);
            if (op[0].contains("{")) {
                statuses.add("404");
            }
            for (String status : statuses) {
                JsonNode media = response(operation, status).path("content").path(PROBLEM_JSON);
                if (media.isMissingNode() || examples(media).isEmpty()) {
                    missing.add(op[1] + " " + op[0] + " " + status);
                }
            }
        }
        assertEquals(List.of(), missing);
    }

    @Test
    void everyJsonExampleValidatesAgainstItsSchema() {
        List<String> violations = new ArrayList<>();
        int checked = 0;
        for (String[] op : operations()) {
            Iterator<Map.Entry<String, JsonNode>> statuses =
                    operation(op).path("responses").fields();
            while (statuses.hasNext()) {
                String status = statuses.next().getKey();
                JsonNode content = response(operation(op), status).path("content");
                for (Iterator<String> types = content.fieldNames(); types.hasNext(); ) {
                    String type = types.next();
                    for (Map.Entry<String, JsonNode> example :
                            examples(content.get(type)).entrySet()) {
                        List<JsonNode> bodies = jsonBodies(type, example.getValue());
                        for (JsonNode body : bodies) {
                            checked++;
                            String found = contract.violations(op[0], op[1], Integer.parseInt(status), type, body);
                            if (!found.isEmpty()) {
                                violations.add(op[1] + " " + op[0] + " " + status + " " + type + " " + example.getKey()
                                        + ": " + found);
                            }
                        }
                    }
                }
            }
        }
        assertEquals(List.of(), violations);
        assertTrue(checked > 20, "JSON examples checked: " + checked);
    }

    /** The JSON values of an example: itself for a JSON media type, each line for NDJSON, none for text. */
    private static List<JsonNode> jsonBodies(String mediaType, JsonNode example) {
        if (mediaType.equals("application/x-ndjson")) {
            List<JsonNode> lines = new ArrayList<>();
            for (String line : example.asText().split("\n")) {
                lines.add(parse(line));
            }
            return lines;
        }
        if (mediaType.endsWith("json")) {
            return List.of(example);
        }
        return List.of();
    }

    @Test
    void every200ExampleIsAnAnswerTheServiceGives() throws IOException {
        List<String> differences = new ArrayList<>();
        try (LiveServer server = LiveServer.start()) {
            for (String[] op : operations()) {
                JsonNode content = response(operation(op), "200").path("content");
                for (Iterator<String> types = content.fieldNames(); types.hasNext(); ) {
                    String type = types.next();
                    for (Map.Entry<String, JsonNode> example :
                            examples(content.get(type)).entrySet()) {
                        String where = op[1] + " " + op[0] + " " + type + " " + example.getKey();
                        LiveServer.Reply live = liveAnswer(server, op, type, example.getKey());
                        assertEquals(200, live.status(), where + ": " + live.text());
                        if (write(where, live.text())) {
                            continue;
                        }
                        String difference = compare(op[0], type, example.getValue(), live.text());
                        if (difference != null) {
                            differences.add(where + ": " + difference);
                        }
                    }
                }
            }
        }
        assertEquals(List.of(), differences);
    }

    /** The live answer a 200 example stands for: GET the path, or POST the request example of the same name. */
    private LiveServer.Reply liveAnswer(LiveServer server, String[] op, String mediaType, String exampleName) {
        String path = concretePath(op, mediaType);
        if (op[1].equals("get")) {
            return server.get(path);
        }
        JsonNode request =
                operation(op).at("/requestBody/content/application~1json/examples/" + exampleName + "/value");
        assertFalse(
                request.isMissingNode(),
                op[1] + " " + op[0] + ": the 200 example " + exampleName + " has a request example of that name");
        return server.post(path, request.toString());
    }

    /** A templated path: the controller format of the media type, else each parameter's first documented value. */
    private String concretePath(String[] op, String mediaType) {
        String template = op[0];
        if (template.equals("/v1/designs/controllers/{format}")) {
            return template.replace(
                    "{format}",
                    switch (mediaType) {
                        case "text/plain" -> "structured-text";
                        case "text/x-c" -> "c";
                        default -> "parameters";
                    });
        }
        String concrete = template;
        for (JsonNode parameter : operation(op).path("parameters")) {
            concrete = concrete.replace(
                    "{" + parameter.get("name").asText() + "}",
                    parameter.at("/schema/enum/0").asText());
        }
        return concrete;
    }

    /** Null when the example is the live answer in shape, else what differs. */
    private static String compare(String path, String mediaType, JsonNode example, String live) {
        switch (mediaType) {
            case "application/json":
                return sameShape(example, parse(live));
            case "application/x-ndjson": {
                String[] exampleLines = example.asText().split("\n");
                String[] liveLines = live.split("\n");
                if (exampleLines.length != liveLines.length) {
                    return exampleLines.length + " lines, live " + liveLines.length;
                }
                for (int i = 0; i < liveLines.length; i++) {
                    String difference = sameShape(parse(exampleLines[i]), parse(liveLines[i]));
                    if (difference != null) {
                        return "line " + i + ": " + difference;
                    }
                }
                return null;
            }
            case "text/plain":
                if (path.equals("/metrics")) {
                    return metricsExcerpt(example.asText(), live);
                }
                return sameMasked(example.asText(), live);
            case "text/x-c", "image/svg+xml", "application/xml":
                return sameMasked(example.asText(), live);
            default: // the contract itself and the page: an excerpt from the start
                return live.startsWith(example.asText()) ? null : "is not the start of the live text";
        }
    }

    /** Every member path of both trees (array elements as [i]), and the JSON type at each. */
    private static String sameShape(JsonNode example, JsonNode live) {
        Set<String> expected = new TreeSet<>();
        Set<String> actual = new TreeSet<>();
        paths(example, "", expected);
        paths(live, "", actual);
        if (expected.equals(actual)) {
            return null;
        }
        Set<String> onlyExample = new TreeSet<>(expected);
        onlyExample.removeAll(actual);
        Set<String> onlyLive = new TreeSet<>(actual);
        onlyLive.removeAll(expected);
        return "only in the example " + first(onlyExample) + ", only live " + first(onlyLive);
    }

    private static Set<String> first(Set<String> all) {
        Set<String> some = new TreeSet<>();
        for (String s : all) {
            if (some.size() == 5) {
                break;
            }
            some.add(s);
        }
        return some;
    }

    private static void paths(JsonNode node, String at, Set<String> out) {
        out.add(at + ":" + node.getNodeType());
        if (node.isObject()) {
            node.fields().forEachRemaining(f -> paths(f.getValue(), at + "/" + f.getKey(), out));
        } else if (node.isArray()) {
            for (int i = 0; i < node.size(); i++) {
                paths(node.get(i), at + "/" + i, out);
            }
        }
    }

    /** Numbers, the version, digests and request ids masked: what stays is the answer's text, which must be the same. */
    private static String sameMasked(String example, String live) {
        // the refresh script writes the contract's version into version attributes (PLCopen productVersion)
        Function<String, String> mask = s -> s.replaceAll("Loopwright [0-9][^ ]*", "Loopwright V")
                .replaceAll("[vV]ersion=\"[^\"]*\"", "version=\"V\"")
                .replaceAll("sha256:[0-9a-f]{64}", "sha256:H")
                .replaceAll("[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}", "ID")
                .replaceAll("-?[0-9]+(\\.[0-9]+)?([eE][-+]?[0-9]+)?", "#")
                .strip();
        String a = mask.apply(example);
        String b = mask.apply(live);
        if (a.equals(b)) {
            return null;
        }
        int i = 0;
        while (i < Math.min(a.length(), b.length()) && a.charAt(i) == b.charAt(i)) {
            i++;
        }
        return "differs at masked character " + i + ": example '"
                + a.substring(i, Math.min(a.length(), i + 60)) + "', live '"
                + b.substring(i, Math.min(b.length(), i + 60))
                + "'";
    }

    /** Each family of the example is declared live with the same TYPE line, and each sample name is served. */
    private static String metricsExcerpt(String example, String live) {
        Set<String> liveLines = new TreeSet<>(List.of(live.split("\n")));
        for (String line : example.split("\n")) {
            if (line.startsWith("# TYPE") && !liveLines.contains(line)) {
                return "not served: " + line;
            }
            if (!line.startsWith("#") && !line.isBlank()) {
                String sample = line.split("[ {]")[0];
                if (liveLines.stream().noneMatch(l -> l.startsWith(sample + " ") || l.startsWith(sample + "{"))) {
                    return "no live sample " + sample;
                }
            }
        }
        return null;
    }

    /**
     * Each problem example under components/examples and the request that makes the service answer it (503: the
     * worker pool's refusal, which a test cannot provoke on demand, is checked against its problem type).
     */
    @Test
    void everyProblemExampleIsAnAnswerTheServiceGives() throws IOException {
        JsonNode examples = contract.document().at("/components/examples");
        List<String> differences = new ArrayList<>();
        Set<String> seen = new TreeSet<>();
        try (LiveServer open = LiveServer.start();
                LiveServer keyed = LiveServer.start(ServiceConfig.fromEnvironment(
                        Map.of("LOOPWRIGHT_PORT", "0", "LOOPWRIGHT_API_KEYS", "example-key-0123456789")))) {
            for (Iterator<Map.Entry<String, JsonNode>> it = examples.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> entry = it.next();
                JsonNode example = entry.getValue().get("value");
                if (!entry.getKey().endsWith("Problem")) {
                    continue;
                }
                seen.add(entry.getKey());
                LiveServer.Reply live = problemAnswer(entry.getKey(), open, keyed);
                if (live == null) {
                    ProblemType type = ProblemType.SERVICE_OVERLOADED;
                    assertEquals(type.uri(), example.path("type").asText(), entry.getKey());
                    assertEquals(type.status(), example.path("status").asInt(), entry.getKey());
                    // the detail as the compute pool words it (service compute/ComputePool, RETRY_AFTER_SECONDS)
                    assertTrue(
                            example.path("detail")
                                    .asText()
                                    .matches(
                                            "all \\d+ design workers are busy and \\d+ designs are queued; retry after "
                                                    + com.loopwright.service.compute.ComputePool.RETRY_AFTER_SECONDS
                                                    + " s"),
                            example.path("detail").asText());
                    continue;
                }
                if (write("problem " + entry.getKey(), live.text())) {
                    continue;
                }
                assertEquals(example.path("status").asInt(), live.status(), entry.getKey() + ": " + live.text());
                String difference = sameShape(example, parse(live.text()));
                if (difference != null) {
                    differences.add(entry.getKey() + ": " + difference);
                }
                if (!example.path("type")
                        .asText()
                        .equals(live.json().path("type").asText())) {
                    differences.add(entry.getKey() + ": type " + live.json().path("type"));
                }
            }
        }
        assertEquals(List.of(), differences);
        assertEquals(
                Set.of(
                        "InvalidFieldProblem",
                        "InvalidSamplesProblem",
                        "PlantWithoutFormProblem",
                        "UnauthorizedProblem",
                        "NotFoundProblem",
                        "MethodNotAllowedProblem",
                        "PayloadTooLargeProblem",
                        "InfeasibleSpecProblem",
                        "FitFailedProblem",
                        "UnstableLoopProblem",
                        "GridCapExceededProblem",
                        "ServiceOverloadedProblem"),
                seen);
    }

    private static final String AXIS_PLANT = "{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}";

    /** The live answer of one problem example; null for the 503 (not provoked on demand). */
    private static LiveServer.Reply problemAnswer(String name, LiveServer open, LiveServer keyed) throws IOException {
        return switch (name) {
            case "InvalidFieldProblem" ->
                open.post(
                        "/v1/designs",
                        "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":0}}");
            case "PlantWithoutFormProblem" ->
                open.post(
                        "/v1/designs",
                        "{\"plant\":{\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                                + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}");
            case "UnauthorizedProblem" ->
                keyed.post(
                        "/v1/designs",
                        "{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}");
            case "NotFoundProblem" ->
                open.post(
                        "/v1/designs/controllers/ladder",
                        "{\"design\":{\"plant\":" + AXIS_PLANT + ",\"spec\":{\"settlingTime\":0.15,"
                                + "\"overshootPercent\":1.5}},\"samplePeriod\":0.001,\"actuatorLimit\":3}");
            case "MethodNotAllowedProblem" -> open.get("/v1/designs");
            case "PayloadTooLargeProblem" -> oversized(open);
            case "InfeasibleSpecProblem" ->
                open.post(
                        "/v1/designs",
                        "{\"plant\":{\"form\":\"canonical\",\"a0\":0.5,\"a1\":0.48,\"b\":65,\"d\":6},"
                                + "\"spec\":{\"settlingTime\":12,\"overshootPercent\":2.66}}");
            case "InvalidSamplesProblem" ->
                open.post("/v1/models/fit", "{\"samples\":{\"time\":[0,0.1,0.2],\"output\":[0,0.5,1]}}");
            case "FitFailedProblem" ->
                open.post(
                        "/v1/models/fit",
                        "{\"samples\":{\"time\":[0,0.1,0.2,0.3,0.4,0.5,0.6,0.7,0.8,0.9],"
                                + "\"output\":[1,1,1,1,1,1,1,1,1,1]},\"stepTime\":0.2}");
            case "UnstableLoopProblem" ->
                open.post(
                        "/v1/verifications",
                        "{\"plant\":" + AXIS_PLANT + ",\"gain\":{\"k1\":-1,\"k2\":0.1,\"referenceGain\":1}}");
            case "GridCapExceededProblem" ->
                open.post(
                        "/v1/design-spaces",
                        "{\"plant\":" + AXIS_PLANT + ",\"settlingTime\":{\"lowest\":0.03,\"highest\":0.3,"
                                + "\"count\":65},\"overshootPercent\":{\"lowest\":0.5,\"highest\":10,\"count\":20}}");
            case "ServiceOverloadedProblem" -> null;
            default -> throw new AssertionError("no live request for the problem example " + name);
        };
    }

    /** A body over the 1 MiB cap, declared by Content-Length (as HttpLayerLimitsTest): 413 before it is read. */
    private static LiveServer.Reply oversized(LiveServer server) throws IOException {
        try (RawExchange socket = new RawExchange(server.app().port(), 10_000)) {
            socket.send("POST /v1/designs HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\n"
                    + "Content-Length: " + (2 << 20) + "\r\nExpect: 100-continue\r\n\r\n");
            RawExchange.Reply reply = socket.read();
            return new LiveServer.Reply(
                    reply.status(),
                    reply.headers().getOrDefault("content-type", ""),
                    reply.body(),
                    parse(reply.body()),
                    java.net.http.HttpHeaders.of(Map.of(), (a, b) -> true));
        }
    }

    private static JsonNode parse(String text) {
        try {
            return JSON.readTree(text);
        } catch (IOException e) {
            throw new AssertionError("not JSON: " + text, e);
        }
    }

    /** With -Dloopwright.examples.write=DIR: each live answer in a file of its own (how the examples were made). */
    private static boolean write(String where, String text) throws IOException {
        String directory = System.getProperty("loopwright.examples.write");
        if (directory == null) {
            return false;
        }
        Path dir = Path.of(directory);
        Files.createDirectories(dir);
        Files.writeString(dir.resolve(where.replaceAll("[^A-Za-z0-9.-]+", "_") + ".txt"), text, StandardCharsets.UTF_8);
        return true;
    }
}
