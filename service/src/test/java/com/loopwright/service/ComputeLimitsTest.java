package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.json.StrictJson;
import com.loopwright.examples.DesignClient;
import com.loopwright.service.compute.Designs;
import com.loopwright.service.compute.ExchangeDesigns;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * The compute deadline, back-pressure of the bounded pool and the graceful stop, exercised with a computation
 * that holds each design at a gate (the real one, released by the test) so that the timing is deterministic.
 */
class ComputeLimitsTest {

    /** The real computation, but each call first waits at a gate the test opens. */
    private static final class GatedDesigns implements Designs {
        private final Designs real = new ExchangeDesigns(StrictJson.newMapper());
        final CountDownLatch gate = new CountDownLatch(1);
        final AtomicInteger entered = new AtomicInteger();

        private void hold() {
            entered.incrementAndGet();
            try {
                gate.await(30, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }

        @Override
        public Reply design(byte[] body) {
            hold();
            return real.design(body);
        }

        @Override
        public Reply design(JsonNode item) {
            hold();
            return real.design(item);
        }
    }

    private static ServiceConfig config(String workers, String queue, String deadlineMillis) {
        return ServiceConfig.fromEnvironment(Map.of(
                "LOOPWRIGHT_PORT",
                "0",
                "LOOPWRIGHT_WORKER_THREADS",
                workers,
                "LOOPWRIGHT_QUEUE_CAPACITY",
                queue,
                "LOOPWRIGHT_COMPUTE_DEADLINE_MS",
                deadlineMillis,
                "LOOPWRIGHT_SHUTDOWN_GRACE_MS",
                "20000"));
    }

    private static void awaitEntered(GatedDesigns designs, int count) throws InterruptedException {
        for (int i = 0; i < 500 && designs.entered.get() < count; i++) {
            Thread.sleep(10);
        }
        assertEquals(count, designs.entered.get(), "designs waiting at the gate");
    }

    @Test
    void aDesignPastTheDeadlineIsA504Problem() {
        GatedDesigns designs = new GatedDesigns();
        try (LiveServer server = LiveServer.start(config("2", "4", "200"), designs)) {
            long started = System.nanoTime();
            var reply = server.post("/v1/designs", DesignClient.INDEXING_AXIS);
            long millis = (System.nanoTime() - started) / 1_000_000;
            assertEquals(504, reply.status(), reply.text());
            assertEquals(
                    "tag:loopwright.dev,2026:problem/deadline-exceeded",
                    reply.json().get("type").asText());
            assertTrue(reply.json().get("detail").asText().contains("200 ms"), reply.text());
            assertTrue(millis >= 200 && millis < 5000, "answered at the deadline, not at the gate: " + millis);
            // In a batch the deadline is per item: the item's line carries the problem, the batch still succeeds.
            var batch = server.post("/v1/designs/batch", "{\"items\":[" + DesignClient.INDEXING_AXIS + "]}");
            assertEquals(200, batch.status());
            assertEquals(504, batch.lines().get(0).get("status").asInt());
            designs.gate.countDown();
            assertEquals(
                    200, server.post("/v1/designs", DesignClient.INDEXING_AXIS).status(), "recovered");
            var metrics = PrometheusText.parse(server.get("/metrics").text());
            assertEquals(2, metrics.sum("loopwright_designs_total", Map.of("outcome", "deadline")));
        }
    }

    @Test
    void aFullPoolRefusesWith503AndRetryAfterThenRecovers() throws Exception {
        GatedDesigns designs = new GatedDesigns();
        // One worker and one queue slot: the third concurrent design has nowhere to go.
        try (LiveServer server = LiveServer.start(config("1", "1", "30000"), designs)) {
            List<CompletableFuture<LiveServer.Reply>> held = new ArrayList<>();
            held.add(CompletableFuture.supplyAsync(() -> server.post("/v1/designs", DesignClient.INDEXING_AXIS)));
            awaitEntered(designs, 1);
            held.add(CompletableFuture.supplyAsync(() -> server.post("/v1/designs", DesignClient.INDEXING_AXIS)));
            for (int i = 0;
                    i < 500 && server.get("/metrics").text().contains("loopwright_design_queue_length 0");
                    i++) {
                Thread.sleep(10);
            }
            var refused = server.post("/v1/designs", DesignClient.INDEXING_AXIS);
            assertEquals(503, refused.status(), refused.text());
            assertEquals(
                    "tag:loopwright.dev,2026:problem/service-overloaded",
                    refused.json().get("type").asText());
            assertEquals("1", refused.header("Retry-After"));
            var refusedBatch = server.post("/v1/designs/batch", "{\"items\":[" + DesignClient.INDEXING_AXIS + "]}");
            assertEquals(503, refusedBatch.status(), "a batch is refused before its 200 is committed");
            assertEquals("1", refusedBatch.header("Retry-After"));
            assertEquals(200, server.get("/health/live").status(), "probes never wait for the pool");
            designs.gate.countDown();
            for (CompletableFuture<LiveServer.Reply> reply : held) {
                assertEquals(200, reply.get(30, TimeUnit.SECONDS).status(), "held designs complete");
            }
            assertEquals(
                    200, server.post("/v1/designs", DesignClient.INDEXING_AXIS).status(), "recovered");
            var metrics = PrometheusText.parse(server.get("/metrics").text());
            assertEquals(1, metrics.sum("loopwright_designs_total", Map.of("outcome", "overloaded")));
        }
    }

    @Test
    void aStopFinishesInFlightRequests() throws Exception {
        GatedDesigns designs = new GatedDesigns();
        LiveServer server = LiveServer.start(config("4", "8", "30000"), designs);
        List<CompletableFuture<LiveServer.Reply>> inFlight = new ArrayList<>();
        for (int i = 0; i < 3; i++) {
            inFlight.add(CompletableFuture.supplyAsync(() -> server.post("/v1/designs", DesignClient.INDEXING_AXIS)));
        }
        inFlight.add(CompletableFuture.supplyAsync(() -> server.post(
                "/v1/designs/batch",
                "{\"items\":[" + DesignClient.INDEXING_AXIS + "," + DesignClient.INDEXING_AXIS + "]}")));
        awaitEntered(designs, 4);
        CompletableFuture<Void> stopping = CompletableFuture.runAsync(server::close);
        Thread.sleep(300);
        assertTrue(!stopping.isDone(), "the stop waits for in-flight requests");
        designs.gate.countDown();
        stopping.get(30, TimeUnit.SECONDS);
        for (int i = 0; i < 3; i++) {
            var reply = inFlight.get(i).get(30, TimeUnit.SECONDS);
            assertEquals(200, reply.status(), "in-flight design " + i + " completed: " + reply.text());
        }
        var batch = inFlight.get(3).get(30, TimeUnit.SECONDS);
        assertEquals(200, batch.status());
        assertEquals(2, batch.lines().size(), "the streaming batch finished every line");
        assertEquals(200, batch.lines().get(1).get("status").asInt());
    }

    @Test
    void readinessFailsOnceAStopHasBegun() throws Exception {
        GatedDesigns designs = new GatedDesigns();
        LiveServer server = LiveServer.start(config("2", "2", "30000"), designs);
        java.net.URI ready = server.base().resolve("/health/ready");
        assertEquals(200, server.get("/health/ready").status());
        CompletableFuture<LiveServer.Reply> held =
                CompletableFuture.supplyAsync(() -> server.post("/v1/designs", DesignClient.INDEXING_AXIS));
        awaitEntered(designs, 1);
        CompletableFuture<Void> stopping = CompletableFuture.runAsync(server::close);
        Thread.sleep(300);
        // A probe during the stop is refused (503 on a kept-alive connection, or no connection at all).
        int status;
        try {
            status = server.http()
                    .send(
                            java.net.http.HttpRequest.newBuilder(ready)
                                    .timeout(java.time.Duration.ofSeconds(5))
                                    .build(),
                            java.net.http.HttpResponse.BodyHandlers.discarding())
                    .statusCode();
        } catch (java.io.IOException refused) {
            status = -1;
        }
        assertTrue(status == 503 || status == -1, "readiness during a stop: " + status);
        designs.gate.countDown();
        stopping.get(30, TimeUnit.SECONDS);
        assertEquals(200, held.get(30, TimeUnit.SECONDS).status(), "the in-flight design still completed");
    }

    /**
     * The indexing axis with a verify object and an uncertainty box: 10 + 10 + 16 = 36 work units, more than
     * BatchRoute.BORROW_MAX_WORK_UNITS, so such items never borrow a worker beyond the batch share.
     */
    private static final String LONG_ITEM =
            DesignClient.INDEXING_AXIS.substring(0, DesignClient.INDEXING_AXIS.length() - 1)
                    + ",\"verify\":{\"uncertainty\":{\"a1\":{\"spreadPercent\":10}}}}";

    @Test
    void batchesOfLongItemsHoldAtMostHalfTheWorkersSoSingleDesignsStillRun() throws Exception {
        GatedDesigns designs = new GatedDesigns();
        assertTrue(new com.loopwright.api.design.ComputeBudget()
                        .designUnits(StrictJson.newMapper().readTree(LONG_ITEM))
                > com.loopwright.service.routes.BatchRoute.BORROW_MAX_WORK_UNITS);
        // Four workers: all batches together hold at most ceil(4/2) = 2; a single design takes a third.
        try (LiveServer server = LiveServer.start(config("4", "8", "30000"), designs)) {
            String items = String.join(",", java.util.Collections.nCopies(5, LONG_ITEM));
            List<CompletableFuture<LiveServer.Reply>> batches = new ArrayList<>();
            for (int i = 0; i < 2; i++) {
                batches.add(CompletableFuture.supplyAsync(
                        () -> server.post("/v1/designs/batch", "{\"items\":[" + items + "]}")));
            }
            awaitEntered(designs, 2);
            Thread.sleep(300);
            assertEquals(2, designs.entered.get(), "two batches of five items hold two of the four workers");
            CompletableFuture<LiveServer.Reply> single =
                    CompletableFuture.supplyAsync(() -> server.post("/v1/designs", DesignClient.INDEXING_AXIS));
            awaitEntered(designs, 3);
            designs.gate.countDown();
            assertEquals(200, single.get(30, TimeUnit.SECONDS).status());
            for (CompletableFuture<LiveServer.Reply> batch : batches) {
                assertInOrderAndDesigned(batch.get(30, TimeUnit.SECONDS), 5);
            }
        }
    }

    @Test
    void aLoneBatchOfShortDesignsComputesOnEveryWorker() throws Exception {
        GatedDesigns designs = new GatedDesigns();
        // Two workers, a share of ceil(2/2) = 1: the second item borrows the idle worker (no request waits).
        try (LiveServer server = LiveServer.start(config("2", "4", "30000"), designs)) {
            String items = String.join(",", java.util.Collections.nCopies(4, DesignClient.INDEXING_AXIS));
            CompletableFuture<LiveServer.Reply> batch = CompletableFuture.supplyAsync(
                    () -> server.post("/v1/designs/batch", "{\"items\":[" + items + "]}"));
            awaitEntered(designs, 2); // both workers hold one of the batch's items at the gate
            designs.gate.countDown();
            assertInOrderAndDesigned(batch.get(30, TimeUnit.SECONDS), 4);
        }
    }

    @Test
    void aBatchItemThePoolRefusesWaitsForTheBatchsOwnOldestItem() throws Exception {
        GatedDesigns designs = new GatedDesigns();
        // Two workers held by single designs and one queue slot: the batch's first item takes the slot, its
        // second is refused by the full pool and must wait for the first instead of becoming a 503 line.
        try (LiveServer server = LiveServer.start(config("2", "1", "30000"), designs)) {
            List<CompletableFuture<LiveServer.Reply>> held = new ArrayList<>();
            for (int i = 0; i < 2; i++) {
                held.add(CompletableFuture.supplyAsync(() -> server.post("/v1/designs", DesignClient.INDEXING_AXIS)));
            }
            awaitEntered(designs, 2);
            String items = String.join(",", java.util.Collections.nCopies(4, DesignClient.INDEXING_AXIS));
            CompletableFuture<LiveServer.Reply> batch = CompletableFuture.supplyAsync(
                    () -> server.post("/v1/designs/batch", "{\"items\":[" + items + "]}"));
            for (int i = 0;
                    i < 500 && server.get("/metrics").text().contains("loopwright_design_queue_length 0");
                    i++) {
                Thread.sleep(10);
            }
            Thread.sleep(100);
            designs.gate.countDown();
            for (CompletableFuture<LiveServer.Reply> reply : held) {
                assertEquals(200, reply.get(30, TimeUnit.SECONDS).status());
            }
            assertInOrderAndDesigned(batch.get(30, TimeUnit.SECONDS), 4);
            var metrics = PrometheusText.parse(server.get("/metrics").text());
            assertEquals(0, metrics.sum("loopwright_designs_total", Map.of("outcome", "overloaded")));
            assertEquals(6, metrics.sum("loopwright_designs_total", Map.of("outcome", "designed")));
        }
    }

    private static void assertInOrderAndDesigned(LiveServer.Reply reply, int items) {
        assertEquals(200, reply.status());
        assertEquals(items, reply.lines().size(), reply.text());
        for (int i = 0; i < items; i++) {
            assertEquals(i, reply.lines().get(i).get("index").asInt(), "request order");
            assertEquals(200, reply.lines().get(i).get("status").asInt(), reply.text());
        }
    }

    @Test
    void batchLinesAreStreamedAsEachItemFinishes() throws Exception {
        // The first item is computed at once; the second waits at the gate until the first line has arrived. The
        // second is told apart by its settling time, not by call order (two workers may start in either order).
        CountDownLatch gate = new CountDownLatch(1);
        Designs real = new ExchangeDesigns(StrictJson.newMapper());
        Designs secondWaits = new Designs() {
            @Override
            public Reply design(byte[] body) {
                return real.design(body);
            }

            @Override
            public Reply design(JsonNode item) {
                if (item.at("/spec/settlingTime").asDouble() == 0.16) {
                    try {
                        gate.await(30, TimeUnit.SECONDS);
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                    }
                }
                return real.design(item);
            }
        };
        try (LiveServer server = LiveServer.start(config("2", "4", "30000"), secondWaits)) {
            var request = java.net.http.HttpRequest.newBuilder(server.base().resolve("/v1/designs/batch"))
                    .header("Content-Type", "application/json")
                    .POST(java.net.http.HttpRequest.BodyPublishers.ofString("{\"items\":[" + DesignClient.INDEXING_AXIS
                            + "," + DesignClient.INDEXING_AXIS.replace("0.15", "0.16") + "]}"))
                    .build();
            var response = server.http().send(request, java.net.http.HttpResponse.BodyHandlers.ofLines());
            assertEquals(200, response.statusCode());
            assertEquals(
                    "application/x-ndjson",
                    response.headers().firstValue("Content-Type").orElse(""));
            var lines = response.body().iterator();
            String first = lines.next();
            assertTrue(first.startsWith("{\"index\":0,\"status\":200"), first);
            assertEquals(1, gate.getCount(), "the first line arrived while the second item was still waiting");
            gate.countDown();
            assertTrue(lines.next().startsWith("{\"index\":1,\"status\":200"));
            assertTrue(!lines.hasNext());
        }
    }
}
