package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.read.ListAppender;
import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.examples.DesignClient;
import java.io.IOException;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slf4j.LoggerFactory;

/**
 * One client must not be able to take the HTTP layer down: slow bodies, many large bodies at once, broken bodies and
 * protocol oddities, each written straight to a loopback socket (bounded in count and time).
 */
class HttpLayerLimitsTest {

    /** A 1 MiB batch body whose one item is an array of 262,140 numbers (the reproduction of issue 13). */
    static final String HUGE_ITEM_BATCH;

    static {
        StringBuilder body = new StringBuilder(1 << 20).append("{\"items\":[[");
        for (int i = 0; i < 262_140; i++) {
            body.append(i == 0 ? "1.5" : ",1.5");
        }
        HUGE_ITEM_BATCH = body.append("]]}").toString();
    }

    private static LiveServer start(Map<String, String> settings) {
        Map<String, String> environment = new HashMap<>(settings);
        environment.put("LOOPWRIGHT_PORT", "0");
        return LiveServer.start(ServiceConfig.fromEnvironment(environment));
    }

    private static String postHead(String path, String extraHeaders) {
        return "POST " + path + " HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\n" + extraHeaders
                + "\r\n";
    }

    /** GET /health on a fresh connection, answered within the bound, or fails. */
    private static void healthAnswersWithin(LiveServer server, Duration bound) throws Exception {
        HttpResponse<String> health = server.http()
                .send(
                        HttpRequest.newBuilder(server.base().resolve("/health"))
                                .timeout(bound)
                                .GET()
                                .build(),
                        HttpResponse.BodyHandlers.ofString());
        assertEquals(200, health.statusCode());
    }

    private static void assertProblem(RawExchange.Reply reply, int status, ProblemType type) throws IOException {
        assertEquals(status, reply.status(), reply.toString());
        assertEquals("application/problem+json", reply.header("Content-Type"), reply.toString());
        JsonNode problem = reply.json();
        assertEquals(status, problem.get("status").asInt(), reply.body());
        assertEquals(type.uri(), problem.get("type").asText(), reply.body());
        // The HTTP layer states the build that answered, as the application does.
        assertEquals(
                com.loopwright.api.endpoint.ServiceVersion.fromBuild(),
                reply.header(com.loopwright.api.endpoint.Trace.VERSION_HEADER),
                reply.toString());
        // The HTTP layer names the occurrence too: the request id it answers in X-Request-Id.
        assertEquals(
                "/requests/" + reply.header("X-Request-Id"),
                problem.path("instance").asText(),
                reply.toString());
        String violations = Contract.load().violations("/v1/designs", "post", 400, "application/problem+json", problem);
        assertTrue(violations.isEmpty(), violations + " in " + problem);
    }

    @Test
    void slowBodiesDoNotHoldRequestThreads() throws Exception {
        // Issue 13: 260 sockets sending one body byte every 5 s took all 250 request threads. Scaled down: 60 slow
        // sockets against 16 request threads, one byte every 250 ms each, a grace long enough that none is cut.
        int sockets = 60;
        try (LiveServer server = start(Map.of("LOOPWRIGHT_HTTP_THREADS", "16", "LOOPWRIGHT_BODY_GRACE_MS", "60000"))) {
            List<RawExchange> slow = new ArrayList<>();
            try {
                for (int i = 0; i < sockets; i++) {
                    slow.add(new RawExchange(server.app().port(), 5_000)
                            .send(postHead("/v1/designs", "Content-Length: 1000\r\n") + "{"));
                }
                long end = System.nanoTime() + Duration.ofSeconds(3).toNanos();
                int probes = 0;
                while (System.nanoTime() < end) {
                    for (RawExchange socket : slow) {
                        socket.send(" ");
                    }
                    healthAnswersWithin(server, Duration.ofSeconds(2));
                    probes++;
                    Thread.sleep(250);
                }
                assertTrue(probes >= 5, "health probes during the attack: " + probes);
                // The real clients are served too: a design while 60 bodies trickle in.
                assertEquals(
                        200,
                        server.post("/v1/designs", DesignClient.INDEXING_AXIS).status());
                for (RawExchange socket : slow) {
                    assertFalse(socket.hasReply(), "a slow body within its grace is not answered yet");
                }
            } finally {
                for (RawExchange socket : slow) {
                    socket.close();
                }
            }
        }
    }

    @Test
    void aBodySlowerThanTheMinimumRateGets408ProblemAndTheConnectionCloses() throws Exception {
        try (LiveServer server =
                        start(Map.of("LOOPWRIGHT_BODY_GRACE_MS", "300", "LOOPWRIGHT_MIN_BODY_BYTES_PER_S", "1000"));
                RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
            long started = System.nanoTime();
            socket.send(postHead("/v1/designs", "Content-Length: 100\r\n") + "{");
            RawExchange.Reply reply = socket.read();
            long millis = (System.nanoTime() - started) / 1_000_000;
            assertProblem(reply, 408, ProblemType.REQUEST_TIMEOUT);
            assertEquals("close", reply.header("Connection"));
            // 1 byte is allowed until 300 ms + 1 byte / (1000 bytes/s) = 301 ms.
            assertTrue(millis >= 290 && millis < 3_000, millis + " ms");
        }
    }

    @Test
    void aBodyThatStallsPastTheIdleTimeoutGets408ProblemNotPlainText() throws Exception {
        try (LiveServer server =
                        start(Map.of("LOOPWRIGHT_IDLE_TIMEOUT_MS", "500", "LOOPWRIGHT_BODY_GRACE_MS", "60000"));
                RawExchange socket = new RawExchange(server.app().port(), 5_000)) {
            RawExchange.Reply reply = socket.send(postHead("/v1/designs", "Content-Length: 100\r\n") + "{")
                    .read();
            assertProblem(reply, 408, ProblemType.REQUEST_TIMEOUT);
        }
    }

    @Test
    void largeBodiesBeyondTheBudgetGet503WithRetryAfterAndHealthAnswers() throws Exception {
        // Issue 13: 200 connections posting a 1 MiB batch exhausted the heap. Here a 2 MiB budget and 12 connections:
        // two bodies are admitted, the other ten are refused before their body is sent (the clients ask with
        // Expect: 100-continue, as large uploads do; without it a refused body is read and dropped first).
        byte[] body = HUGE_ITEM_BATCH.getBytes(java.nio.charset.StandardCharsets.US_ASCII);
        assertTrue(body.length <= 1 << 20, "the body is within the request cap: " + body.length);
        int connections = 12;
        try (LiveServer server = start(Map.of(
                "LOOPWRIGHT_MAX_INFLIGHT_BODY_BYTES", String.valueOf(2 << 20), "LOOPWRIGHT_HTTP_THREADS", "16"))) {
            List<RawExchange> sockets = new ArrayList<>();
            try {
                for (int i = 0; i < connections; i++) {
                    sockets.add(new RawExchange(server.app().port(), 20_000)
                            .send(postHead(
                                    "/v1/designs/batch",
                                    "Content-Length: " + body.length
                                            + "\r\nConnection: close\r\nExpect: 100-continue\r\n")));
                }
                Thread.sleep(300);
                healthAnswersWithin(server, Duration.ofSeconds(2));
                int refused = 0;
                int served = 0;
                for (RawExchange socket : sockets) {
                    RawExchange.Reply first = socket.read();
                    if (first.status() == 100) {
                        // Admitted: asked for the body, which is then read and served.
                        socket.send(body);
                        RawExchange.Reply reply = socket.read();
                        assertEquals(200, reply.status(), reply.body());
                        // One item that is not an object: one problem line, never a 500.
                        assertTrue(reply.body().contains("\"status\":400"), reply.body());
                        served++;
                        healthAnswersWithin(server, Duration.ofSeconds(2));
                    } else {
                        assertProblem(first, 503, ProblemType.SERVICE_OVERLOADED);
                        assertEquals("1", first.header("Retry-After"));
                        refused++;
                    }
                }
                assertEquals(10, refused, "refused with 503 before the body was read");
                assertEquals(2, served, "admitted and served");
            } finally {
                for (RawExchange socket : sockets) {
                    socket.close();
                }
            }
        }
    }

    @Test
    void expectContinueWithABodyOverTheCapGets413AtOnce() throws Exception {
        try (LiveServer server = start(Map.of());
                RawExchange socket = new RawExchange(server.app().port(), 3_000)) {
            socket.send(postHead("/v1/designs", "Content-Length: 5000000\r\nExpect: 100-continue\r\n"));
            RawExchange.Reply reply = socket.read();
            assertProblem(reply, 413, ProblemType.PAYLOAD_TOO_LARGE);
            assertTrue(reply.json().get("detail").asText().contains("1048576"), reply.body());
        }
    }

    @Test
    void anHttp2PrefaceGets426WithAProblem() throws Exception {
        try (LiveServer server = start(Map.of());
                RawExchange socket = new RawExchange(server.app().port(), 3_000)) {
            RawExchange.Reply reply =
                    socket.send("PRI * HTTP/2.0\r\n\r\nSM\r\n\r\n").read();
            assertProblem(reply, 426, ProblemType.UNSUPPORTED_PROTOCOL);
        }
    }

    @Test
    void aBadRequestLineIsAnHttpProblemNotAJsonOne() throws Exception {
        try (LiveServer server = start(Map.of());
                RawExchange socket = new RawExchange(server.app().port(), 3_000)) {
            RawExchange.Reply reply = socket.send("BLAH\r\n\r\n").read();
            assertProblem(reply, 400, ProblemType.MALFORMED_HTTP);
            assertFalse(reply.body().contains("JSON"), reply.body());
        }
    }

    @Test
    void aBadChunkSizeIs400AndOneWarnLineWithoutAStackTrace() throws Exception {
        List<ILoggingEvent> events = captureDuring(() -> {
            try (LiveServer server = start(Map.of());
                    RawExchange socket = new RawExchange(server.app().port(), 3_000)) {
                RawExchange.Reply reply = socket.send(
                                postHead("/v1/designs", "Transfer-Encoding: chunked\r\n") + "ZZ\r\nabc\r\n")
                        .read();
                assertProblem(reply, 400, ProblemType.MALFORMED_HTTP);
            }
        });
        assertOneWarnWithoutTrace(events);
    }

    @Test
    void aBodyCutOffMidwayIsOneWarnLineAndNever500() throws Exception {
        List<ILoggingEvent> events = captureDuring(() -> {
            try (LiveServer server = start(Map.of())) {
                try (RawExchange socket = new RawExchange(server.app().port(), 3_000)) {
                    socket.send(postHead("/v1/designs", "Content-Length: 1000\r\n") + "{\"plant\":");
                }
                // The client is gone: nothing to answer, one line to log; the server keeps serving.
                for (int i = 0; i < 100 && warnings().isEmpty(); i++) {
                    Thread.sleep(20);
                }
                assertEquals(200, server.get("/health").status());
            }
        });
        assertOneWarnWithoutTrace(events);
    }

    private interface Exchange {
        void run() throws Exception;
    }

    /** Events of every logger, captured by {@link #captureDuring}. */
    private final ListAppender<ILoggingEvent> captured = new ListAppender<>();

    private List<ILoggingEvent> warnings() {
        synchronized (captured.list) {
            return captured.list.stream()
                    .filter(e -> e.getLevel().isGreaterOrEqual(Level.WARN))
                    .toList();
        }
    }

    /** Every event of level WARN or above logged by any logger while {@code exchange} runs. */
    private List<ILoggingEvent> captureDuring(Exchange exchange) throws Exception {
        Logger root = (Logger) LoggerFactory.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME);
        captured.start();
        root.addAppender(captured);
        try {
            exchange.run();
            Thread.sleep(100); // a line logged on another thread just after the reply
        } finally {
            root.detachAppender(captured);
        }
        return warnings();
    }

    private static void assertOneWarnWithoutTrace(List<ILoggingEvent> events) {
        assertEquals(1, events.size(), events.toString());
        ILoggingEvent line = events.get(0);
        assertEquals(Level.WARN, line.getLevel(), line.toString());
        assertNull(line.getThrowableProxy(), "no stack trace: " + line);
        assertTrue(line.getFormattedMessage().length() < 400, line.getFormattedMessage());
        assertFalse(line.getFormattedMessage().contains("\n"), line.getFormattedMessage());
    }
}
