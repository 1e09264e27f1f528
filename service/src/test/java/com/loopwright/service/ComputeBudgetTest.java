package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.examples.DesignClient;
import com.loopwright.service.compute.Designs;
import com.loopwright.service.compute.ExchangeDesigns;
import com.loopwright.solver.cancel.ComputationCancelledException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;

/**
 * The compute budget of a request: the estimated-work cap on a batch, one deadline over all items of a batch, and
 * cancellation of a computation at its deadline. Stub computations keep every test short on any build.
 */
class ComputeBudgetTest {

    /** One design with every check at its cap (the item of the 918 KB batch). */
    static final String EVERY_CHECK = """
            {"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":1.5},
             "verify":{"uncertainty":{"a0":{"spreadPercent":10},"a1":{"spreadPercent":10},
               "b":{"spreadPercent":10},"d":{"spreadPercent":10},"monteCarloSamples":2000,"seed":7},
              "disturbances":[{"shape":"step","amplitude":1},{"shape":"pulse","amplitude":1,"duration":0.05},
               {"shape":"sinusoid","amplitude":1,"frequency":10},{"shape":"randomBounded","amplitude":1,"holdTime":0.01},
               {"shape":"step","amplitude":2},{"shape":"pulse","amplitude":2,"duration":0.02},
               {"shape":"sinusoid","amplitude":2,"frequency":30},{"shape":"randomBounded","amplitude":2,"holdTime":0.02}],
              "actuatorLimit":1,"sampling":{"samplePeriod":0.00001,"findLongest":true},"inputDelay":0.001,
              "frequencyPoints":500,"timeSeriesPoints":1000}}""";

    private static ServiceConfig config(String workers, String deadlineMillis) {
        return ServiceConfig.fromEnvironment(Map.of(
                "LOOPWRIGHT_PORT",
                "0",
                "LOOPWRIGHT_WORKER_THREADS",
                workers,
                "LOOPWRIGHT_QUEUE_CAPACITY",
                "16",
                "LOOPWRIGHT_COMPUTE_DEADLINE_MS",
                deadlineMillis));
    }

    /** Answers every item at once without computing, counting the calls. */
    private static final class CountingDesigns implements Designs {
        final AtomicInteger calls = new AtomicInteger();

        @Override
        public Reply design(byte[] body) {
            calls.incrementAndGet();
            return Reply.failure(ProblemType.INFEASIBLE_SPEC.problem("stub"));
        }

        @Override
        public Reply design(JsonNode item) {
            return design(new byte[0]);
        }
    }

    // The reproduction: 1000 items, each with every check, cost 322 CPU-seconds and were all answered 200.
    @Test
    void aBatchOverTheWorkCapIsRefusedWith422NamingTheFieldsThatDriveTheCost() {
        CountingDesigns designs = new CountingDesigns();
        String body = "{\"items\":[" + String.join(",", Collections.nCopies(1000, EVERY_CHECK)) + "]}";
        assertTrue(body.getBytes(StandardCharsets.UTF_8).length < (1 << 20), "inside the body cap");
        try (LiveServer server = LiveServer.start(config("2", "10000"), designs)) {
            var reply = server.postBytes("/v1/designs/batch", body.getBytes(StandardCharsets.UTF_8));
            assertEquals(
                    422,
                    reply.status(),
                    reply.text().substring(0, Math.min(400, reply.text().length())));
            assertEquals(
                    "tag:loopwright.dev,2026:problem/cap-exceeded",
                    reply.json().get("type").asText());
            assertEquals("/items", reply.json().at("/errors/0/pointer").asText());
            // Monte Carlo dominates: 2000 samples x 1000 items of about 4.3 million units.
            assertEquals(
                    "/items/0/verify/uncertainty/monteCarloSamples",
                    reply.json().at("/errors/1/pointer").asText());
            assertEquals(0, designs.calls.get(), "nothing was computed");

            // The same items, few enough to fit the cap, are computed.
            var fits = server.post(
                    "/v1/designs/batch",
                    "{\"items\":[" + String.join(",", Collections.nCopies(11, EVERY_CHECK)) + "]}");
            assertEquals(200, fits.status(), fits.text());
            assertEquals(11, fits.lines().size());
        }
    }

    /** Each item sleeps 150 ms unless interrupted; counts calls and interruptions. */
    /**
     * Each stub item sleeps this long; the batch deadline falls in the middle of the third round of items (rounds
     * start at 0, 300 and 600 ms on two workers, the deadline at 750 ms), so scheduling jitter of up to 150 ms on a
     * loaded machine moves no item across the deadline.
     */
    private static final long ITEM_MILLIS = 300;

    private static final class SleepingDesigns implements Designs {
        final AtomicInteger calls = new AtomicInteger();
        final AtomicInteger interrupted = new AtomicInteger();

        @Override
        public Reply design(byte[] body) {
            calls.incrementAndGet();
            try {
                Thread.sleep(ITEM_MILLIS);
            } catch (InterruptedException e) {
                interrupted.incrementAndGet();
                Thread.currentThread().interrupt();
            }
            return Reply.failure(ProblemType.INFEASIBLE_SPEC.problem("stub"));
        }

        @Override
        public Reply design(JsonNode item) {
            return design(new byte[0]);
        }
    }

    // Each item's deadline used to start at its own submission: a long batch never timed out.
    @Test
    void oneDeadlineCoversEveryItemOfABatch() throws Exception {
        SleepingDesigns designs = new SleepingDesigns();
        try (LiveServer server = LiveServer.start(config("2", "750"), designs)) {
            String items = String.join(",", Collections.nCopies(10, DesignClient.INDEXING_AXIS));
            var reply = server.post("/v1/designs/batch", "{\"items\":[" + items + "]}");
            assertEquals(200, reply.status());
            List<JsonNode> lines = reply.lines();
            assertEquals(10, lines.size());
            assertEquals(422, lines.get(0).get("status").asInt(), "the first item finished in time");
            assertEquals(504, lines.get(9).get("status").asInt(), reply.text());
            assertTrue(lines.get(9).at("/problem/detail").asText().contains("every item of a batch"), reply.text());
            assertTrue(designs.calls.get() < 10, "items past the deadline are not computed: " + designs.calls.get());
            for (int i = 0; i < 200 && designs.interrupted.get() == 0; i++) {
                Thread.sleep(10);
            }
            // Short items of a lone batch run on both workers (one on the batch share, one borrowed), so one or
            // two items are running at the deadline; each of them is interrupted, no other.
            int interrupted = designs.interrupted.get();
            assertTrue(
                    interrupted >= 1 && interrupted <= 2,
                    "the items running at the deadline were interrupted: " + interrupted);
        }
    }

    /** The real computation, recording how it ended. */
    private static final class RecordingDesigns implements Designs {
        private final Designs real = new ExchangeDesigns(StrictJson.newMapper());
        final AtomicReference<String> ending = new AtomicReference<>();
        final CountDownLatch ended = new CountDownLatch(1);

        @Override
        public Reply design(byte[] body) {
            try {
                Reply outcome = real.design(body);
                ending.set("returned " + outcome.status());
                return outcome;
            } catch (ComputationCancelledException e) {
                ending.set("cancelled");
                throw e;
            } finally {
                ended.countDown();
            }
        }

        @Override
        public Reply design(JsonNode item) {
            throw new UnsupportedOperationException();
        }
    }

    // A computation past its deadline used to run to its end (2000 Monte Carlo samples here) after the 504.
    @Test
    void aComputationPastItsDeadlineStopsAtItsNextCheckpoint() throws Exception {
        RecordingDesigns designs = new RecordingDesigns();
        try (LiveServer server = LiveServer.start(config("1", "30"), designs)) {
            var reply = server.post("/v1/designs", EVERY_CHECK);
            assertEquals(504, reply.status(), reply.text());
            assertTrue(designs.ended.await(30, TimeUnit.SECONDS));
            assertEquals("cancelled", designs.ending.get());
        }
    }

    @Test
    void theEstimateNamesEveryCheckAndStaysBoundedForOutOfRangeCounts() throws Exception {
        var budget = new com.loopwright.api.design.ComputeBudget();
        var mapper = StrictJson.newMapper();
        // source: the cost model of docs/limits-and-budgets.md, summed by hand:
        // 10 design + 10 verify + 16 corners + 2000 samples + 8 x 25 + 40 + 700 + 500 + 700 + ceil(1500/30)
        assertEquals(
                10 + 10 + 16 + 2000 + 200 + 40 + 700 + 500 + 700 + 50,
                budget.designUnits(mapper.readTree(EVERY_CHECK)));
        assertEquals(10, budget.designUnits(mapper.readTree(DesignClient.INDEXING_AXIS)));
        // The batch estimate hands each item's own estimate back (the batch route's borrow rule reads it).
        List<JsonNode> batch = List.of(mapper.readTree(DesignClient.INDEXING_AXIS), mapper.readTree(EVERY_CHECK));
        long[] itemUnits = new long[2];
        assertEquals(null, budget.refuseBatch(2, batch::get, itemUnits), "4236 units are within the cap");
        assertEquals(10, itemUnits[0]);
        assertEquals(10 + 10 + 16 + 2000 + 200 + 40 + 700 + 500 + 700 + 50, itemUnits[1]);
        List<String> hostile = new ArrayList<>(List.of(
                "{\"verify\":{\"uncertainty\":{\"monteCarloSamples\":1e300}}}",
                "{\"verify\":{\"uncertainty\":{\"monteCarloSamples\":\"many\"}}}",
                "{\"verify\":[1,2]}"));
        for (String request : hostile) {
            assertTrue(budget.designUnits(mapper.readTree(request)) <= 10 + 10 + 16 + 2000, request);
        }
    }

    @Test
    void aSampledRobustDesignIsChargedItsSimulatedSearchInsteadOfTheClosedFormOne() throws Exception {
        var budget = new com.loopwright.api.design.ComputeBudget();
        var mapper = StrictJson.newMapper();
        String box = "\"uncertainty\":{\"b\":{\"spreadPercent\":10},\"monteCarloSamples\":100}";
        // source: the cost model of docs/limits-and-budgets.md, summed by hand: 10 design + 2000 + 100 x 50
        assertEquals(
                10 + 2000 + 100 * 50,
                budget.designUnits(mapper.readTree("{\"robust\":{" + box + ",\"samplePeriod\":0.004}}")));
        // the same box in continuous time: 10 + 200 + 100 x 5 (closed-form search)
        assertEquals(10 + 200 + 100 * 5, budget.designUnits(mapper.readTree("{\"robust\":{" + box + "}}")));
        // with integral action the loop's 400 units come on top: 10 + 400 + 2000 + 100 x 50
        assertEquals(
                10 + 400 + 2000 + 100 * 50,
                budget.designUnits(
                        mapper.readTree("{\"integralAction\":true,\"robust\":{" + box + ",\"samplePeriod\":0.004}}")));
    }
}
