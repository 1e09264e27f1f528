package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.javalin.Javalin;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.Map;

/**
 * The real service on a free loopback port, and a client whose every response is checked against the schema
 * openapi.yaml declares for it (a response the contract does not describe fails the test).
 */
final class LiveServer implements AutoCloseable {

    private static final ObjectMapper JSON = new ObjectMapper();

    private final Javalin app;
    private final HttpClient http =
            HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private final Contract contract = Contract.load();

    private LiveServer(Javalin app) {
        this.app = app;
    }

    static LiveServer start() {
        return start(ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_PORT", "0")));
    }

    static LiveServer start(ServiceConfig config) {
        return start(config, null);
    }

    static LiveServer start(ServiceConfig config, com.loopwright.service.compute.Designs designs) {
        return new LiveServer(LoopwrightApp.create(config, designs).start("127.0.0.1", 0));
    }

    static LiveServer start(ServiceConfig config, com.loopwright.service.compute.Designs designs, FatalErrors fatal) {
        return new LiveServer(LoopwrightApp.create(config, designs, fatal).start("127.0.0.1", 0));
    }

    /** Starts an application built by the test itself (on loopback, a free port). */
    static LiveServer started(Javalin app) {
        return new LiveServer(app.start("127.0.0.1", 0));
    }

    Javalin app() {
        return app;
    }

    HttpClient http() {
        return http;
    }

    Contract contract() {
        return contract;
    }

    URI base() {
        return URI.create("http://127.0.0.1:" + app.port());
    }

    /** A response and its body parsed as JSON (null when the body is not JSON). */
    record Reply(int status, String contentType, String text, JsonNode json, java.net.http.HttpHeaders headers) {

        String header(String name) {
            return headers.firstValue(name).orElse(null);
        }

        /** The lines of an NDJSON body, each parsed. */
        java.util.List<JsonNode> lines() {
            java.util.List<JsonNode> lines = new java.util.ArrayList<>();
            for (String line : text.split("\n")) {
                try {
                    lines.add(JSON.readTree(line));
                } catch (IOException e) {
                    throw new AssertionError("line is not JSON: " + line, e);
                }
            }
            return lines;
        }
    }

    Reply post(String path, String body) {
        return post(path, body, "application/json");
    }

    Reply post(String path, String body, String contentType) {
        HttpRequest.Builder request = HttpRequest.newBuilder(base().resolve(path))
                .timeout(Duration.ofSeconds(30))
                .POST(HttpRequest.BodyPublishers.ofString(body));
        if (contentType != null) {
            request.header("Content-Type", contentType);
        }
        return send(request.build(), path, "post");
    }

    Reply postBytes(String path, byte[] body) {
        // No Expect: 100-continue: the service answers an oversized body with 413 before reading it, and the JDK 17
        // client then waits forever for the 100 (JDK-8286171, from memory). Oversized bodies go through RawExchange.
        return send(
                HttpRequest.newBuilder(base().resolve(path))
                        .timeout(Duration.ofSeconds(30))
                        .header("Content-Type", "application/json")
                        .POST(HttpRequest.BodyPublishers.ofByteArray(body))
                        .build(),
                path,
                "post");
    }

    Reply get(String path) {
        return send(
                HttpRequest.newBuilder(base().resolve(path))
                        .timeout(Duration.ofSeconds(30))
                        .GET()
                        .build(),
                path,
                "get");
    }

    Reply send(HttpRequest request, String path, String method) {
        HttpResponse<String> response;
        try {
            response = http.send(request, HttpResponse.BodyHandlers.ofString());
        } catch (IOException e) {
            throw new AssertionError("request failed: " + e, e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError(e);
        }
        String contentType = response.headers().firstValue("Content-Type").orElse("");
        String mediaType = contentType.split(";")[0].trim();
        JsonNode json = null;
        if (mediaType.equals("application/x-ndjson")) {
            checkLines(path, method, response.statusCode(), mediaType, response.body());
        } else if (mediaType.endsWith("json")) {
            try {
                json = JSON.readTree(response.body());
            } catch (IOException e) {
                throw new AssertionError("body is not JSON: " + response.body(), e);
            }
            checkAgainstContract(path, method, response.statusCode(), mediaType, json);
        }
        return new Reply(response.statusCode(), mediaType, response.body(), json, response.headers());
    }

    /** NDJSON: every line is one JSON object, and each validates against the schema declared for the body. */
    private void checkLines(String path, String method, int status, String mediaType, String body) {
        assertTrue(body.isEmpty() || body.endsWith("\n"), "NDJSON ends with a line feed");
        for (String line : body.split("\n")) {
            if (line.isEmpty()) {
                continue;
            }
            JsonNode json;
            try {
                json = JSON.readTree(line);
            } catch (IOException e) {
                throw new AssertionError("NDJSON line is not JSON: " + line, e);
            }
            String violations = contract.violations(path, method, status, mediaType, json);
            assertTrue(
                    violations.isEmpty(),
                    "line of " + method + " " + path + " does not conform: " + violations + " in " + line);
        }
    }

    private void checkAgainstContract(String path, String method, int status, String mediaType, JsonNode json) {
        boolean documentedPath = !contract.document()
                .at("/paths/" + path.replace("/", "~1") + "/" + method)
                .isMissingNode();
        if (status >= 400) {
            // Every error anywhere is a problem+json that conforms to the Problem schema.
            assertEquals("application/problem+json", mediaType, "error media type");
            String violations = contract.violations("/v1/designs", "post", 400, mediaType, json);
            assertTrue(violations.isEmpty(), "problem does not conform: " + violations + " in " + json);
            assertEquals(status, json.get("status").asInt(), "status member equals HTTP status");
        }
        if (documentedPath) {
            String violations = contract.violations(path, method, status, mediaType, json);
            assertTrue(
                    violations.isEmpty(),
                    "response to " + method + " " + path + " " + status + " does not conform: " + violations + " in "
                            + json);
        }
    }

    @Override
    public void close() {
        app.stop();
    }
}
