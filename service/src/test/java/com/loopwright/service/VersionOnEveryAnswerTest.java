package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.endpoint.ServiceVersion;
import com.loopwright.api.endpoint.Trace;
import java.net.http.HttpRequest;
import java.time.Duration;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Every answer states which build answered it ({@value Trace#VERSION_HEADER}), one class of answer per case: the
 * application's 200 and problems (400, 401, 403, 404, 405, 415), the body gate's refusal (413) and the problems Jetty
 * answers before any handler (a broken request line, headers over the cap). The gate's 408 and 503 and Jetty's 426
 * are checked where they are provoked (HttpLayerLimitsTest), the other Jetty-level answers in RawHttpTest.
 */
class VersionOnEveryAnswerTest {

    private static final String KEY = "version-test-key-0123456789abcdef";
    private static final int MAX_REQUEST_BYTES = 4096;
    private static final String DESIGN =
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";

    private static LiveServer server;

    @BeforeAll
    static void start() {
        Map<String, String> environment = new HashMap<>();
        environment.put("LOOPWRIGHT_PORT", "0");
        environment.put("LOOPWRIGHT_API_KEYS", KEY);
        environment.put("LOOPWRIGHT_MAX_REQUEST_BYTES", String.valueOf(MAX_REQUEST_BYTES));
        server = LiveServer.start(ServiceConfig.fromEnvironment(environment));
    }

    @AfterAll
    static void stop() {
        server.close();
    }

    private static HttpRequest.Builder request(String path) {
        return HttpRequest.newBuilder(server.base().resolve(path)).timeout(Duration.ofSeconds(30));
    }

    private static void assertVersioned(LiveServer.Reply reply, int status) {
        assertEquals(status, reply.status(), reply.text());
        assertEquals(
                ServiceVersion.fromBuild(),
                reply.headers().firstValue(Trace.VERSION_HEADER).orElse("(none)"),
                status + " " + reply.text());
        assertTrue(reply.headers().firstValue("X-Request-Id").isPresent());
    }

    @Test
    void theApplicationsAnswersStateTheVersion() {
        assertVersioned(server.get("/health"), 200);
        assertVersioned(server.get("/no-such-resource"), 404);
        LiveServer.Reply notAllowed = server.send(request("/health").DELETE().build(), "/health", "delete");
        assertVersioned(notAllowed, 405);
        LiveServer.Reply noKey = server.post("/v1/designs", DESIGN);
        assertVersioned(noKey, 401);
        LiveServer.Reply wrongKey = server.send(
                request("/v1/designs")
                        .header("Authorization", "Bearer not-the-key")
                        .header("Content-Type", "application/json")
                        .POST(HttpRequest.BodyPublishers.ofString(DESIGN))
                        .build(),
                "/v1/designs",
                "post");
        assertVersioned(wrongKey, 403);
        LiveServer.Reply textBody = server.send(
                request("/v1/designs")
                        .header("Authorization", "Bearer " + KEY)
                        .header("Content-Type", "text/plain")
                        .POST(HttpRequest.BodyPublishers.ofString(DESIGN))
                        .build(),
                "/v1/designs",
                "post");
        assertVersioned(textBody, 415);
        LiveServer.Reply malformed = server.send(
                request("/v1/designs")
                        .header("Authorization", "Bearer " + KEY)
                        .header("Content-Type", "application/json")
                        .POST(HttpRequest.BodyPublishers.ofString("{\"plant\":"))
                        .build(),
                "/v1/designs",
                "post");
        assertVersioned(malformed, 400);
    }

    @Test
    void theBodyGatesRefusalStatesTheVersion() throws Exception {
        try (RawExchange exchange = new RawExchange(server.app().port(), 10_000)) {
            RawExchange.Reply tooLarge = exchange.send("POST /v1/designs HTTP/1.1\r\nHost: 127.0.0.1\r\n"
                            + "Authorization: Bearer " + KEY + "\r\nContent-Type: application/json\r\n"
                            + "Expect: 100-continue\r\nContent-Length: " + (MAX_REQUEST_BYTES + 1) + "\r\n\r\n")
                    .read();
            assertEquals(413, tooLarge.status(), tooLarge.toString());
            assertEquals(ServiceVersion.fromBuild(), tooLarge.header(Trace.VERSION_HEADER), tooLarge.toString());
        }
    }

    @Test
    void jettysOwnProblemsStateTheVersion() throws Exception {
        String[] raw = {
            "BLAH\r\n\r\n",
            "GET /health HTTP/1.1\r\nHost: x\r\nX-Big: " + "y".repeat(64 * 1024) + "\r\nConnection: close\r\n\r\n",
            "GET /%ZZ HTTP/1.1\r\nHost: x\r\nConnection: close\r\n\r\n"
        };
        for (String request : raw) {
            try (RawExchange exchange = new RawExchange(server.app().port(), 10_000)) {
                RawExchange.Reply reply = exchange.send(request).read();
                assertTrue(reply.status() >= 400 && reply.status() < 500, reply.toString());
                assertEquals(ServiceVersion.fromBuild(), reply.header(Trace.VERSION_HEADER), reply.toString());
            }
        }
    }
}
