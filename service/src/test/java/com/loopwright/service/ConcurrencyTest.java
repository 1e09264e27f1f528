package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.examples.DesignClient;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Queue;
import java.util.Random;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/**
 * 8 client threads x 500 mixed requests (designs, infeasible and invalid specs, batches, probes, the contract,
 * unknown paths) give byte-identical status and body to the same requests sent one at a time: the service
 * is stateless and the pool shares nothing between designs.
 */
class ConcurrencyTest {

    static final int THREADS = 8;
    static final int REQUESTS_PER_THREAD = 500;
    static final long SEED = 8_500L;

    private record Call(String method, String path, String body) {}

    private static final List<Call> CALLS = List.of(
            new Call("POST", "/v1/designs", DesignClient.INDEXING_AXIS),
            // Camera gimbal axis, tank-level loop by rise time, conveyor without a disturbance channel.
            new Call("POST", "/v1/designs", """
                    {"plant":{"form":"canonical","a0":0,"a1":2,"b":150,"d":60},"spec":{"settlingTime":0.3,"overshootPercent":1}}"""),
            new Call("POST", "/v1/designs", """
                    {"plant":{"form":"canonical","a0":0.04,"a1":0.5,"b":0.02,"d":0.05},
                     "spec":{"riseTime":3,"overshootPercent":2,"settlingBandPercent":5}}"""),
            new Call("POST", "/v1/designs", """
                    {"plant":{"form":"canonical","a0":1,"a1":0.1,"b":3,"d":0},"spec":{"settlingTime":2,"overshootPercent":0.5}}"""),
            new Call("POST", "/v1/designs", DesignClient.INDEXING_AXIS.replace("1.5}", "10}")),
            new Call(
                    "POST",
                    "/v1/designs",
                    "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":0,\"d\":400},\"spec\":{}}"),
            new Call("POST", "/v1/designs", "{\"plant\":"),
            new Call(
                    "POST",
                    "/v1/designs/batch",
                    "{\"items\":[" + DesignClient.INDEXING_AXIS + ",{},"
                            + DesignClient.INDEXING_AXIS.replace("0.15", "0.4") + "]}"),
            new Call("GET", "/health", null),
            new Call("GET", "/health/ready", null),
            new Call("GET", "/openapi.yaml", null),
            new Call("GET", "/v1/nothing", null));

    private static String send(HttpClient http, LiveServer server, Call call) throws Exception {
        // A request id of its own: the reply must name it (a problem's instance), never another request's.
        String requestId = "concurrency-" + java.util.UUID.randomUUID();
        HttpRequest.Builder request = HttpRequest.newBuilder(server.base().resolve(call.path()))
                .timeout(Duration.ofSeconds(60))
                .header("X-Request-Id", requestId);
        if (call.body() != null) {
            request.header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(call.body()));
        }
        HttpResponse<String> response = http.send(request.build(), HttpResponse.BodyHandlers.ofString());
        // The reply with its own request id replaced, so that replies to equal requests compare equal.
        return response.statusCode() + " "
                + response.headers().firstValue("Content-Type").orElse("") + "\n"
                + response.body()
                        .replace("/requests/" + requestId + "\"", "/requests/ID\"")
                        .replace("/requests/" + requestId + "#", "/requests/ID#");
    }

    @Test
    void concurrentResultsEqualSequentialOnes() throws Exception {
        HttpClient http =
                HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).build();
        try (LiveServer server = LiveServer.start()) {
            List<String> sequential = new ArrayList<>();
            for (Call call : CALLS) {
                sequential.add(send(http, server, call));
            }
            assertTrue(sequential.get(0).startsWith("200"), sequential.get(0));
            assertTrue(sequential.get(4).startsWith("422"), sequential.get(4));
            Queue<String> mismatches = new ConcurrentLinkedQueue<>();
            ExecutorService clients = Executors.newFixedThreadPool(THREADS);
            for (int t = 0; t < THREADS; t++) {
                Random random = new Random(SEED + t);
                clients.submit(() -> {
                    for (int i = 0; i < REQUESTS_PER_THREAD; i++) {
                        int pick = random.nextInt(CALLS.size());
                        try {
                            String reply = send(http, server, CALLS.get(pick));
                            if (!reply.equals(sequential.get(pick))) {
                                mismatches.add(pick + ": " + reply.substring(0, Math.min(300, reply.length())));
                            }
                        } catch (Exception e) {
                            mismatches.add(pick + ": " + e);
                        }
                    }
                });
            }
            clients.shutdown();
            assertTrue(clients.awaitTermination(170, TimeUnit.SECONDS), "finished in time");
            assertEquals(
                    0,
                    mismatches.size(),
                    "first mismatches: " + mismatches.stream().limit(3).toList());
            // Every request is counted once (the count of a request lands just after its response, so poll).
            double expected = THREADS * REQUESTS_PER_THREAD + CALLS.size();
            double counted = 0;
            for (int attempt = 0; attempt < 50 && counted < expected; attempt++) {
                Thread.sleep(attempt == 0 ? 0 : 40);
                counted = PrometheusText.parse(server.get("/metrics").text())
                                .sum("loopwright_http_requests_total", java.util.Map.of())
                        - attempt;
            }
            assertEquals(expected, counted, "every request was counted once");
        }
    }
}
