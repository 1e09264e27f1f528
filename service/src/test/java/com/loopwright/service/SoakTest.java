package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfSystemProperty;

/**
 * Soak test against a running jar (bench/soak.sh starts it under -Xmx256m and passes its URL and process id): a
 * few rounds of mixed load replayed from the golden corpus (designs, batches, order-n designs, fits,
 * verifications with Monte Carlo, plots and controller exports), each request's status equal to the recorded
 * one, no 5xx, every JSON and NDJSON body valid against openapi.yaml, and the resident memory after round
 * {@link #COMPARED_ROUND} within {@link #RSS_GROWTH_LIMIT} of round 1 (read from /proc/PID/status, VmRSS; the script
 * pre-touches the heap, so this is the growth outside it).
 * Runs only when {@code loopwright.soak.url} is set; loopback only; bounded in count and time.
 */
@EnabledIfSystemProperty(named = "loopwright.soak.url", matches = "http://127\\.0\\.0\\.1:[0-9]+")
class SoakTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final Path CORPUS = Path.of("src", "test", "resources", "golden");
    /** Rounds of load, and the round whose memory is compared with round 1's. */
    static final int ROUNDS = 5;

    static final int COMPARED_ROUND = 3;
    /** Resident memory after round 3 may exceed round 1's by at most this fraction. */
    static final double RSS_GROWTH_LIMIT = 0.10;
    /** Requests in flight at once (well under the pool's queue, so nothing is refused for load). */
    static final int CONCURRENCY = 4;
    /** A round stops issuing requests after this long; the whole soak stays within CI's budget for it. */
    static final long ROUND_BUDGET_MILLIS = 30_000;
    /** Each round replays the corpus (a few hundred requests) this many times. */
    static final int REPLAYS_PER_ROUND = 3;
    /** At most this many requests per round. */
    static final int MAX_REQUESTS_PER_ROUND = 1500;

    private record Case(String id, String method, String path, String contentType, String body, int status) {}

    private record Answer(Case sent, int status, String mediaType, String body) {}

    /** Bodies validated against a JSON schema of the contract in the current round (main thread only). */
    private int validatedBodies;

    @Test
    void mixedLoadKeepsMemoryFlatAndEveryAnswerInTheContract() throws Exception {
        URI base = URI.create(System.getProperty("loopwright.soak.url"));
        long pid = Long.parseLong(System.getProperty("loopwright.soak.pid", "-1"));
        List<Case> cases = openCases();
        assertTrue(cases.size() > 100, "the corpus holds the mixed load: " + cases.size());
        Contract contract = Contract.load();
        HttpClient http = HttpClient.newBuilder()
                .connectTimeout(Duration.ofSeconds(5))
                .executor(Executors.newFixedThreadPool(CONCURRENCY))
                .build();
        long[] rssKib = new long[ROUNDS + 1];
        ExecutorService clients = Executors.newFixedThreadPool(CONCURRENCY);
        try {
            for (int round = 1; round <= ROUNDS; round++) {
                long started = System.nanoTime();
                long end = started + TimeUnit.MILLISECONDS.toNanos(ROUND_BUDGET_MILLIS);
                List<Future<Answer>> pending = new ArrayList<>();
                for (int i = 0; i < cases.size() * REPLAYS_PER_ROUND && i < MAX_REQUESTS_PER_ROUND; i++) {
                    Case c = cases.get(i % cases.size());
                    pending.add(clients.submit(() -> System.nanoTime() > end ? null : send(http, base, c)));
                }
                int answered = 0;
                int serverErrors = 0;
                validatedBodies = 0;
                List<String> wrong = new ArrayList<>();
                for (Future<Answer> future : pending) {
                    Answer answer = future.get(ROUND_BUDGET_MILLIS * 2, TimeUnit.MILLISECONDS);
                    if (answer == null) {
                        continue; // past the round's budget: not sent
                    }
                    answered++;
                    if (answer.status() >= 500) {
                        serverErrors++;
                    }
                    String problem = check(contract, answer);
                    if (problem != null && wrong.size() < 10) {
                        wrong.add(problem);
                    }
                }
                double seconds = (System.nanoTime() - started) / 1e9;
                rssKib[round] = residentKib(pid);
                System.out.printf(
                        "soak: round %d: %d requests in %.1f s, %d 5xx, %d off-contract (%d bodies schema-checked),"
                                + " VmRSS %d KiB%n",
                        round, answered, seconds, serverErrors, wrong.size(), validatedBodies, rssKib[round]);
                assertEquals(0, serverErrors, "no 5xx in round " + round);
                assertTrue(wrong.isEmpty(), "round " + round + ": " + String.join("\n", wrong));
                assertTrue(answered >= cases.size(), "round " + round + " answered " + answered);
                assertTrue(validatedBodies >= answered / 2, "most bodies are JSON checked against their schema");
            }
        } finally {
            clients.shutdownNow();
        }
        if (pid > 0) {
            double growth = (double) (rssKib[COMPARED_ROUND] - rssKib[1]) / rssKib[1];
            System.out.printf(
                    "soak: VmRSS round 1 %d KiB, round %d %d KiB: %+.1f %% (limit %+.0f %%)%n",
                    rssKib[1], COMPARED_ROUND, rssKib[COMPARED_ROUND], 100 * growth, 100 * RSS_GROWTH_LIMIT);
            assertTrue(growth <= RSS_GROWTH_LIMIT, "resident memory grew " + growth);
        }
    }

    /** The POST cases of the open server without credentials: the service's whole computing surface. */
    private static List<Case> openCases() throws IOException {
        List<Case> cases = new ArrayList<>();
        for (String line : Files.readAllLines(CORPUS.resolve("cases.jsonl"), StandardCharsets.UTF_8)) {
            JsonNode c = JSON.readTree(line);
            if (!c.get("server").asText().equals("open") || !c.get("headers").isEmpty()) {
                continue;
            }
            String id = c.get("id").asText();
            String first = Files.readAllLines(CORPUS.resolve("responses").resolve(id + ".txt"), StandardCharsets.UTF_8)
                    .get(0);
            cases.add(new Case(
                    id,
                    c.get("method").asText(),
                    c.get("path").asText(),
                    c.path("contentType").asText(""),
                    c.path("body").asText(""),
                    Integer.parseInt(first.substring("status: ".length()).trim())));
        }
        return cases;
    }

    private static Answer send(HttpClient http, URI base, Case c) throws IOException, InterruptedException {
        HttpRequest.Builder request = HttpRequest.newBuilder(base.resolve(c.path()))
                .timeout(Duration.ofSeconds(30))
                .header("X-Request-Id", "soak-" + c.id());
        if (c.method().equals("GET")) {
            request.GET();
        } else {
            if (!c.contentType().isEmpty()) {
                request.header("Content-Type", c.contentType());
            }
            request.method(c.method(), HttpRequest.BodyPublishers.ofString(c.body()));
        }
        HttpResponse<String> response = http.send(request.build(), HttpResponse.BodyHandlers.ofString());
        String mediaType = response.headers()
                .firstValue("Content-Type")
                .orElse("")
                .split(";")[0]
                .trim();
        return new Answer(c, response.statusCode(), mediaType, response.body());
    }

    /** Null when the answer has the recorded status and its body conforms to the contract; else why not. */
    private String check(Contract contract, Answer answer) {
        Case c = answer.sent();
        if (answer.status() != c.status()) {
            return c.id() + ": status " + answer.status() + ", recorded " + c.status();
        }
        String path = template(c.path());
        String method = c.method().toLowerCase(java.util.Locale.ROOT);
        boolean documented = !contract.document()
                .at("/paths/" + path.replace("/", "~1") + "/" + method)
                .isMissingNode();
        try {
            if (answer.status() >= 400) {
                if (!answer.mediaType().equals("application/problem+json")) {
                    return c.id() + ": error media type " + answer.mediaType();
                }
                String violations = contract.violations(
                        "/v1/designs", "post", 400, answer.mediaType(), JSON.readTree(answer.body()));
                validatedBodies++;
                return violations.isEmpty() ? null : c.id() + ": problem off-contract: " + violations;
            }
            if (!documented) {
                return null;
            }
            if (answer.mediaType().equals("application/x-ndjson")) {
                for (String line : answer.body().split("\n")) {
                    if (!line.isEmpty()) {
                        String violations = contract.violations(
                                path, method, answer.status(), answer.mediaType(), JSON.readTree(line));
                        if (!violations.isEmpty()) {
                            return c.id() + ": line off-contract: " + violations;
                        }
                    }
                }
                validatedBodies++;
                return null;
            }
            if (answer.mediaType().endsWith("json")) {
                String violations = contract.violations(
                        path, method, answer.status(), answer.mediaType(), JSON.readTree(answer.body()));
                validatedBodies++;
                return violations.isEmpty() ? null : c.id() + ": off-contract: " + violations;
            }
            // Other media types (SVG, C, Structured Text, YAML, HTML): declared for this response.
            contract.responseSchema(path, method, answer.status(), answer.mediaType());
            return null;
        } catch (IOException | AssertionError e) {
            return c.id() + ": " + e.getMessage();
        }
    }

    /** The contract's path template of a concrete path. */
    private static String template(String path) {
        if (path.startsWith("/v1/designs/plots/")) {
            return "/v1/designs/plots/{figure}";
        }
        if (path.startsWith("/v1/designs/controllers/")) {
            return "/v1/designs/controllers/{format}";
        }
        return path;
    }

    private static long residentKib(long pid) throws IOException {
        if (pid <= 0) {
            return -1;
        }
        for (String line : Files.readAllLines(Path.of("/proc", String.valueOf(pid), "status"))) {
            if (line.startsWith("VmRSS:")) {
                return Long.parseLong(line.replaceAll("[^0-9]", ""));
            }
        }
        throw new IOException("no VmRSS line for process " + pid);
    }
}
