package com.loopwright.service.compute;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.problem.Problem;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.function.Function;
import java.util.function.Supplier;
import org.junit.jupiter.api.Test;

/**
 * The batch share and the borrow rule of {@link ComputePool} with {@link BatchLane} (the rule as documented in
 * openapi.yaml: batches hold ceil(workers/2) workers; a short item may take a worker beyond that only while the
 * worker is idle and no request waits, and a worker a batch holds goes on with the batch's next item only while
 * nothing is queued). Every computation is held at its own latch, so the order of events is fixed without timing:
 * a computation that has not started while both workers are held cannot have started.
 */
class ComputePoolBorrowTest {

    private static final long WAIT_SECONDS = 10;
    private static final Function<Problem, String> PROBLEM = problem -> "problem: " + problem.detail();

    /** A computation that says when it started and ends when the test lets it. */
    private static final class Held implements Supplier<String> {
        final CountDownLatch started = new CountDownLatch(1);
        final CountDownLatch release = new CountDownLatch(1);
        private final String name;

        Held(String name) {
            this.name = name;
        }

        @Override
        public String get() {
            started.countDown();
            try {
                release.await(WAIT_SECONDS, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return name + " interrupted";
            }
            return name;
        }

        boolean hasStarted() throws InterruptedException {
            return started.await(WAIT_SECONDS, TimeUnit.SECONDS);
        }

        boolean notStarted() {
            return started.getCount() == 1;
        }
    }

    @Test
    void aLoneBatchOfShortItemsComputesOnEveryWorkerAndChainsItsItems() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            assertEquals(1, pool.batchShare(), "ceil(2/2)");
            BatchLane<String> lane = pool.batchLane(PROBLEM, pool.deadlineFromNow());
            Held first = new Held("first");
            Held second = new Held("second");
            Held third = new Held("third");
            var firstReply = lane.add(first, true);
            var secondReply = lane.add(second, true);
            var thirdReply = lane.add(third, true);
            lane.serve(0);
            assertEquals(2, lane.workersHeld(), "a slot of the share and the idle second worker, borrowed");
            // Both items are computing at once: each started while the other is still held.
            assertTrue(first.hasStarted());
            assertTrue(second.hasStarted());
            assertTrue(third.notStarted(), "both workers are held: the third item waits in the lane");
            // The worker that ends the first item goes on with the third itself (nothing is queued).
            first.release.countDown();
            assertEquals("first", firstReply.await());
            assertTrue(third.hasStarted(), "the third item was taken by a worker the batch holds");
            assertEquals(0, pool.queuedDesigns());
            second.release.countDown();
            third.release.countDown();
            assertEquals("second", secondReply.await());
            assertEquals("third", thirdReply.await());
        }
    }

    @Test
    void anItemThatIsNotShortNeverBorrows() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            BatchLane<String> lane = pool.batchLane(PROBLEM, pool.deadlineFromNow());
            Held first = new Held("first");
            Held second = new Held("long");
            var firstReply = lane.add(first, false);
            var secondReply = lane.add(second, false);
            lane.serve(0);
            assertTrue(first.hasStarted());
            assertEquals(1, lane.workersHeld(), "a worker is idle, but an item that is not short keeps to the share");
            assertTrue(second.notStarted());
            first.release.countDown();
            second.release.countDown();
            assertEquals("first", firstReply.await());
            assertEquals("long", secondReply.await(), "computed after the first, on the share");
        }
    }

    @Test
    void aSingleRequestGetsAWorkerWhileABatchRuns() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            BatchLane<String> lane = pool.batchLane(PROBLEM, pool.deadlineFromNow());
            Held batchItem = new Held("batch");
            var batchReply = lane.add(batchItem, false);
            lane.serve(0);
            assertTrue(batchItem.hasStarted());
            // A single request finds the other worker at once.
            Held single = new Held("single");
            var singleReply = pool.submit(single, PROBLEM);
            assertTrue(single.hasStarted(), "the single request runs while the batch item is still held");
            assertEquals(1, batchItem.release.getCount());
            single.release.countDown();
            batchItem.release.countDown();
            assertEquals("single", singleReply.await());
            assertEquals("batch", batchReply.await());
        }
    }

    @Test
    void aWaitingSingleRequestGoesBeforeTheBatchsNextItem() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            // A lone batch holds both workers (one on its share, one borrowed while it was idle).
            BatchLane<String> lane = pool.batchLane(PROBLEM, pool.deadlineFromNow());
            Held a = new Held("a");
            Held b = new Held("b");
            Held next = new Held("next");
            var aReply = lane.add(a, true);
            var bReply = lane.add(b, true);
            var nextReply = lane.add(next, true);
            lane.serve(0);
            assertTrue(a.hasStarted());
            assertTrue(b.hasStarted());
            // A single request arrives: it is queued.
            Held single = new Held("single");
            var singleReply = pool.submit(single, PROBLEM);
            assertEquals(1, pool.queuedDesigns(), "the single request waits in the queue");
            // One of the batch's workers ends its item: the single request gets that worker, not the batch's next
            // item (were it the other way round, the single request would not start while `a` is held).
            b.release.countDown();
            assertEquals("b", bReply.await());
            assertTrue(single.hasStarted(), "the single request got the freed worker");
            lane.serve(0);
            assertTrue(next.notStarted(), "the batch's next item waits: both workers are held");
            assertEquals(1, a.release.getCount());
            // The single request ends: the batch's next item gets a worker (its share, or the idle worker).
            single.release.countDown();
            assertEquals("single", singleReply.await());
            for (int i = 0; i < 1000 && next.notStarted(); i++) {
                lane.serve(0); // the single request's claim is given back as its worker ends it
                Thread.sleep(1);
            }
            assertTrue(next.hasStarted(), "the batch's next item got a worker once no request waited");
            assertEquals(1, a.release.getCount(), "while `a` still computes");
            a.release.countDown();
            next.release.countDown();
            assertEquals("a", aReply.await());
            assertEquals("next", nextReply.await());
        }
    }

    @Test
    void aWriterWaitingForItsItemGetsAWorkerBackAfterAQueuedRequest() throws Exception {
        try (ComputePool pool = new ComputePool(1, 4, 30_000)) {
            BatchLane<String> lane = pool.batchLane(PROBLEM, pool.deadlineFromNow());
            Held a = new Held("a");
            Held b = new Held("b");
            var aReply = lane.add(a, true);
            var bReply = lane.add(b, true);
            lane.serve(0);
            assertTrue(a.hasStarted());
            Held single = new Held("single");
            var singleReply = pool.submit(single, PROBLEM);
            // The stream's writer waits for `b` (as BatchRoute does, on the lane).
            var writer = CompletableFuture.supplyAsync(() -> lane.awaitDone(bReply, 30_000_000_000L));
            // `a` ends: its worker goes to the queued single request, and the lane holds no worker any more.
            a.release.countDown();
            assertTrue(single.hasStarted(), "the queued single request went first");
            assertTrue(b.notStarted());
            // The single request ends: the waiting writer, woken when its lane's last worker was given back, has
            // asked for a slot of the share again, so `b` is computed without any other call.
            single.release.countDown();
            assertTrue(b.hasStarted(), "the writer got the batch a worker again");
            b.release.countDown();
            assertTrue(writer.get(WAIT_SECONDS, TimeUnit.SECONDS));
            assertEquals("a", aReply.await());
            assertEquals("single", singleReply.await());
            assertEquals("b", bReply.await());
        }
    }

    @Test
    void itemsPastTheDeadlineAreCancelledAndTheWorkersGivenBack() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            BatchLane<String> lane = pool.batchLane(PROBLEM, System.nanoTime() + 100_000_000L);
            Held running = new Held("running");
            Held waiting = new Held("waiting");
            Held other = new Held("other");
            var runningReply = lane.add(running, false);
            var waitingReply = lane.add(waiting, false);
            lane.serve(0);
            assertTrue(running.hasStarted());
            // Past the deadline: the running item is interrupted, the waiting one never starts.
            assertTrue(runningReply.await().startsWith("problem:"));
            assertTrue(waitingReply.await().startsWith("problem:"));
            assertTrue(waiting.notStarted());
            // Every claim was given back: a new batch gets both workers again.
            BatchLane<String> again = pool.batchLane(PROBLEM, pool.deadlineFromNow());
            Held first = new Held("first");
            var firstReply = again.add(first, true);
            var otherReply = again.add(other, true);
            for (int i = 0; i < 1000 && again.workersHeld() < 2; i++) {
                again.serve(0); // the cancelled item's worker is given back once it has stopped
                Thread.sleep(1);
            }
            assertEquals(2, again.workersHeld());
            assertTrue(first.hasStarted());
            assertTrue(other.hasStarted());
            first.release.countDown();
            other.release.countDown();
            assertEquals("first", firstReply.await());
            assertEquals("other", otherReply.await());
        }
    }
}
