package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.examples.DesignClient;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Queue;
import java.util.Random;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * 10,000 seeded requests built from openapi.yaml's schemas and mutated, against every documented path (and
 * wrong methods and media types): no 5xx, every 4xx a valid problem+json without internal names, every 200
 * valid against its schema, and the server healthy afterwards.
 */
class FuzzTest {

    static final int REQUESTS = 10_000;
    static final long SEED = 20_261_202L;
    static final int CLIENT_THREADS = 4;
    static final int DESIGN_SAMPLE = 10;
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final String SAFE = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789-._~";
    private static final String HEADER_CHARS = SAFE + " !\"#$%&'()*+,/:;<=>?@[\\]^`{|}";

    private final Contract contract = Contract.load();
    private final SchemaFuzzer fuzzer = new SchemaFuzzer(contract.document());
    private final JsonNode example = contract.document()
            .at("/paths/~1v1~1designs/post/requestBody/content/application~1json/examples/indexingAxis/value");

    private record Shot(String method, String path, String contentType, byte[] body, Map<String, String> headers) {}

    @Test
    void mutatedRequestsNeverGet5xxAndEveryErrorIsAProblem() throws Exception {
        List<String> getPaths = new ArrayList<>();
        List<String> postPaths = new ArrayList<>();
        for (Iterator<Map.Entry<String, JsonNode>> paths =
                        contract.document().get("paths").fields();
                paths.hasNext(); ) {
            Map.Entry<String, JsonNode> path = paths.next();
            (path.getValue().has("post") ? postPaths : getPaths).add(path.getKey());
        }
        HttpClient http = HttpClient.newBuilder()
                .version(HttpClient.Version.HTTP_1_1)
                .connectTimeout(Duration.ofSeconds(5))
                .build();
        Queue<String> failures = new ConcurrentLinkedQueue<>();
        AtomicInteger sent = new AtomicInteger();
        AtomicInteger designs = new AtomicInteger();
        AtomicInteger statuses5xx = new AtomicInteger();
        Map<Integer, AtomicInteger> statuses = new java.util.concurrent.ConcurrentHashMap<>();
        try (LiveServer server = LiveServer.start()) {
            ExecutorService clients = Executors.newFixedThreadPool(CLIENT_THREADS);
            for (int t = 0; t < CLIENT_THREADS; t++) {
                int thread = t;
                clients.submit(() -> {
                    for (int i = thread; i < REQUESTS; i += CLIENT_THREADS) {
                        Shot shot;
                        try {
                            shot = shot(new Random(SEED + i), getPaths, postPaths);
                        } catch (RuntimeException e) {
                            failures.add(i + " could not build a request: " + e);
                            sent.incrementAndGet();
                            continue;
                        }
                        try {
                            int status = check(http, server.base(), shot, failures, designs, statuses5xx);
                            statuses.computeIfAbsent(status, k -> new AtomicInteger())
                                    .incrementAndGet();
                        } catch (Exception | AssertionError e) {
                            failures.add(i + " " + shot.method() + " " + shot.path() + ": " + e);
                        }
                        sent.incrementAndGet();
                    }
                });
            }
            clients.shutdown();
            assertTrue(clients.awaitTermination(170, TimeUnit.SECONDS), "fuzzing finished in time");
            assertEquals(REQUESTS, sent.get());
            assertEquals(0, statuses5xx.get(), "5xx responses: " + failures);
            assertTrue(
                    failures.isEmpty(),
                    failures.size() + " failures, first: "
                            + failures.stream().limit(5).toList());
            assertTrue(designs.get() > 100, "some requests were valid designs: " + designs.get());
            // The mutations reach every kind of rejection (so that this test cannot pass by sending nothing bad).
            for (int expected : new int[] {200, 400, 404, 405, 413, 415, 422}) {
                assertTrue(statuses.containsKey(expected), "no " + expected + " among " + statuses);
            }
            // Healthy afterwards: probes answer and the README design still comes out right.
            System.out.println("fuzz statuses " + statuses + ", designs " + designs.get());
            assertEquals(200, server.get("/health/ready").status());
            var after = server.post("/v1/designs", DesignClient.INDEXING_AXIS);
            assertEquals(200, after.status());
            assertTrue(after.json().at("/verification/certified").asBoolean());
            PrometheusText.parse(server.get("/metrics").text());
        }
    }

    private Shot shot(Random random, List<String> getPaths, List<String> postPaths) {
        List<String> otherPosts = postPaths.stream()
                .filter(p -> !p.equals("/v1/designs") && !p.equals("/v1/designs/batch"))
                .toList();
        int pick = random.nextInt(100);
        Map<String, String> headers = new java.util.HashMap<>();
        if (random.nextInt(4) == 0) {
            headers.put(
                    "X-Request-Id",
                    randomText(random, HEADER_CHARS, random.nextInt(300)).trim());
        }
        if (random.nextInt(10) == 0) {
            headers.put("Origin", "https://" + randomText(random, SAFE, 12) + ".example");
        }
        if (pick < 35) {
            JsonNode base = random.nextBoolean() ? example : fuzzer.valid("DesignRequest", random);
            return new Shot("POST", "/v1/designs", "application/json", fuzzer.mutate(base, random), headers);
        }
        if (pick < 55) {
            // Every other POST endpoint: its contract example (or a schema-valid body), mutated. Examples keep
            // the expensive options (Monte Carlo counts, horizons) at the sizes the contract shows.
            String path = otherPosts.get(random.nextInt(otherPosts.size()));
            JsonNode operation = contract.document().get("paths").get(path).get("post");
            JsonNode examples = operation.at("/requestBody/content/application~1json/examples");
            JsonNode base;
            List<JsonNode> named = new ArrayList<>();
            examples.elements().forEachRemaining(named::add);
            if (!named.isEmpty() && random.nextInt(4) > 0) {
                base = named.get(random.nextInt(named.size())).get("value");
            } else {
                String schema = operation
                        .at("/requestBody/content/application~1json/schema/$ref")
                        .asText();
                base = fuzzer.valid(schema.substring(schema.lastIndexOf('/') + 1), random);
            }
            return new Shot(
                    "POST",
                    concrete(path, operation, random),
                    "application/json",
                    fuzzer.mutate(base, random),
                    headers);
        }
        if (pick < 70) {
            JsonNode base = fuzzer.valid("BatchRequest", random);
            return new Shot("POST", "/v1/designs/batch", "application/json", fuzzer.mutate(base, random), headers);
        }
        if (pick < 90) {
            String path = getPaths.get(random.nextInt(getPaths.size()));
            path = concrete(path, contract.document().get("paths").get(path).path("get"), random);
            if (random.nextBoolean()) {
                path += "?" + randomText(random, SAFE, random.nextInt(40)) + "=%"
                        + "0123456789ABCDEF".charAt(random.nextInt(16)) + "0123456789ABCDEF".charAt(random.nextInt(16));
            }
            return new Shot("GET", path, null, null, headers);
        }
        // Wrong methods and media types on every path.
        List<String> all = new ArrayList<>(getPaths);
        all.addAll(postPaths);
        all.add("/v1/" + randomText(random, SAFE, 8));
        String path = all.get(random.nextInt(all.size()));
        JsonNode pathItem = contract.document().get("paths").path(path);
        path = concrete(path, pathItem.has("post") ? pathItem.get("post") : pathItem.path("get"), random);
        String method = new String[] {"POST", "PUT", "DELETE", "PATCH", "GET"}[random.nextInt(5)];
        String type = new String[] {
                    "text/plain", "application/xml", "application/json; charset=latin1", "application/jsonx", null
                }
                [random.nextInt(5)];
        byte[] body = method.equals("GET") ? null : SchemaFuzzer.bytes(example);
        return new Shot(method, path, type, body, headers);
    }

    /** A templated path with each {parameter} set to one of its documented values, or now and then to junk. */
    private static String concrete(String template, JsonNode operation, Random random) {
        String concrete = template;
        for (JsonNode parameter : operation.path("parameters")) {
            JsonNode values = parameter.at("/schema/enum");
            String value = values.size() > 0 && random.nextInt(8) > 0
                    ? values.get(random.nextInt(values.size())).asText()
                    : randomText(random, SAFE, 1 + random.nextInt(12));
            concrete = concrete.replace("{" + parameter.get("name").asText() + "}", value);
        }
        return concrete;
    }

    private static String randomText(Random random, String alphabet, int length) {
        StringBuilder text = new StringBuilder(length);
        for (int i = 0; i < length; i++) {
            text.append(alphabet.charAt(random.nextInt(alphabet.length())));
        }
        return text.toString();
    }

    private int check(
            HttpClient http,
            URI base,
            Shot shot,
            Queue<String> failures,
            AtomicInteger designs,
            AtomicInteger statuses5xx)
            throws IOException, InterruptedException {
        HttpRequest.Builder request = HttpRequest.newBuilder(base.resolve(shot.path()))
                .timeout(Duration.ofSeconds(60))
                .method(
                        shot.method(),
                        shot.body() == null
                                ? HttpRequest.BodyPublishers.noBody()
                                : HttpRequest.BodyPublishers.ofByteArray(shot.body()));
        if (shot.contentType() != null) {
            request.header("Content-Type", shot.contentType());
        }
        shot.headers().forEach(request::header);
        HttpResponse<String> response = http.send(request.build(), HttpResponse.BodyHandlers.ofString());
        int status = response.statusCode();
        String where = shot.method() + " " + shot.path() + " -> " + status + ": ";
        String mediaType = response.headers()
                .firstValue("Content-Type")
                .orElse("")
                .split(";")[0]
                .trim();
        String body = response.body();
        if (status >= 500) {
            statuses5xx.incrementAndGet();
            failures.add(where + body);
            return status;
        }
        if (body.contains("Exception") || body.contains("com.loopwright") || body.contains("at java.")) {
            failures.add(where + "internal names leak: " + body);
        }
        if (status >= 400) {
            if (!mediaType.equals("application/problem+json")) {
                failures.add(where + "error is " + mediaType + ": " + body);
                return status;
            }
            JsonNode problem = JSON.readTree(body);
            String violations = contract.violations("/v1/designs", "post", 400, mediaType, problem);
            if (!violations.isEmpty() || problem.path("status").asInt() != status) {
                failures.add(where + "invalid problem: " + violations + " " + body);
            }
            return status;
        }
        // Designs are validated against their schema in a deterministic sample (every schema check of a full
        // design costs about as much as the design; LiveServer-based tests validate every one).
        boolean validate = designs.get() % DESIGN_SAMPLE == 0;
        if (shot.path().equals("/v1/designs") && status == 200) {
            designs.incrementAndGet();
            if (!validate) {
                return status;
            }
            String violations = contract.violations("/v1/designs", "post", 200, mediaType, JSON.readTree(body));
            if (!violations.isEmpty()) {
                failures.add(where + "invalid design: " + violations);
            }
        }
        if (shot.path().equals("/v1/designs/batch") && status == 200) {
            for (String line : body.split("\n")) {
                JsonNode parsed = JSON.readTree(line);
                String violations = validate || parsed.path("status").asInt() != 200
                        ? contract.violations("/v1/designs/batch", "post", 200, mediaType, parsed)
                        : "";
                if (!violations.isEmpty() || parsed.path("status").asInt() >= 500) {
                    failures.add(where + "bad batch line: " + violations + " " + line);
                }
                if (parsed.path("status").asInt() == 200) {
                    designs.incrementAndGet();
                }
            }
        }
        return status;
    }
}
