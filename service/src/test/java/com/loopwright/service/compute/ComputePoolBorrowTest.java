package com.loopwright.service.compute;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.problem.Problem;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.function.Function;
import java.util.function.Supplier;
import org.junit.jupiter.api.Test;

/**
 * The batch share and the borrow rule of {@link ComputePool} (the rule as documented in openapi.yaml: batches hold
 * at most ceil(workers/2) workers; a short item may take a worker beyond that only while the worker is idle and no
 * request waits). Every computation is held at its own latch, so the order of events is fixed without timing.
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
            }
            return name;
        }

        boolean hasStarted() throws InterruptedException {
            return started.await(WAIT_SECONDS, TimeUnit.SECONDS);
        }
    }

    private static long deadline(ComputePool pool) {
        return pool.deadlineFromNow();
    }

    @Test
    void aLoneBatchOfShortItemsComputesOnEveryWorker() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            assertEquals(1, pool.batchShare(), "ceil(2/2)");
            long deadline = deadline(pool);
            Held first = new Held("first");
            Held second = new Held("second");
            var onShare = pool.submitBatchItem(first, PROBLEM, deadline, true, true);
            assertTrue(first.hasStarted());
            var borrowed = pool.submitBatchItem(second, PROBLEM, deadline, false, true);
            assertNotNull(borrowed, "the idle second worker is borrowed");
            // Both items are computing at once: the second started while the first is still held.
            assertTrue(second.hasStarted());
            assertEquals(1, first.release.getCount(), "the first item is still computing");
            assertNull(
                    pool.submitBatchItem(new Held("third"), PROBLEM, deadline, false, true),
                    "no slot and no idle worker: the third item waits for the batch's own oldest");
            first.release.countDown();
            second.release.countDown();
            assertEquals("first", onShare.await());
            assertEquals("second", borrowed.await());
        }
    }

    @Test
    void anItemThatIsNotShortNeverBorrows() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            long deadline = deadline(pool);
            Held first = new Held("first");
            var onShare = pool.submitBatchItem(first, PROBLEM, deadline, true, false);
            assertTrue(first.hasStarted());
            assertNull(
                    pool.submitBatchItem(new Held("long"), PROBLEM, deadline, false, false),
                    "a worker is idle, but an item that is not short keeps to the batch share");
            first.release.countDown();
            assertEquals("first", onShare.await());
        }
    }

    @Test
    void aSingleRequestGetsAWorkerWhileABatchRuns() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            long deadline = deadline(pool);
            // The batch holds its share.
            Held batchItem = new Held("batch");
            var onShare = pool.submitBatchItem(batchItem, PROBLEM, deadline, true, true);
            assertTrue(batchItem.hasStarted());
            // A single request finds the other worker at once.
            Held single = new Held("single");
            var singleReply = pool.submit(single, PROBLEM);
            assertTrue(single.hasStarted(), "the single request runs while the batch item is still held");
            assertEquals(1, batchItem.release.getCount());
            single.release.countDown();
            batchItem.release.countDown();
            assertEquals("single", singleReply.await());
            assertEquals("batch", onShare.await());
        }
    }

    @Test
    void aWaitingSingleRequestGoesBeforeAnyBorrow() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            long deadline = deadline(pool);
            // A lone batch holds both workers: one on its share, one borrowed while it was idle.
            Held onShare = new Held("share");
            Held borrowed = new Held("borrowed");
            var shareReply = pool.submitBatchItem(onShare, PROBLEM, deadline, true, true);
            assertTrue(onShare.hasStarted());
            var borrowedReply = pool.submitBatchItem(borrowed, PROBLEM, deadline, false, true);
            assertNotNull(borrowedReply);
            assertTrue(borrowed.hasStarted());
            // A single request arrives: it is queued, and while it waits no batch item may borrow.
            Held single = new Held("single");
            var singleReply = pool.submit(single, PROBLEM);
            assertEquals(1, pool.queuedDesigns(), "the single request waits in the queue");
            assertNull(
                    pool.submitBatchItem(new Held("next"), PROBLEM, deadline, false, true),
                    "no borrow while a request waits");
            // The borrowed worker frees: it takes the single request, not a batch item.
            borrowed.release.countDown();
            assertEquals("borrowed", borrowedReply.await());
            assertTrue(single.hasStarted(), "the single request got the freed worker");
            assertEquals(1, onShare.release.getCount(), "while the batch's share item still computes");
            assertNull(
                    pool.submitBatchItem(new Held("next"), PROBLEM, deadline, false, true),
                    "both workers busy: still no borrow");
            single.release.countDown();
            onShare.release.countDown();
            assertEquals("single", singleReply.await());
            assertEquals("share", shareReply.await());
            // Everything ended: the claims are back to zero, so a short item may borrow again.
            Held again = new Held("again");
            var share = pool.submitBatchItem(again, PROBLEM, deadline, true, true);
            Held beyond = new Held("beyond");
            var borrowedAgain = pool.submitBatchItem(beyond, PROBLEM, deadline, false, true);
            assertNotNull(borrowedAgain, "every claim was given back");
            assertTrue(beyond.hasStarted());
            again.release.countDown();
            beyond.release.countDown();
            assertEquals("again", share.await());
            assertEquals("beyond", borrowedAgain.await());
        }
    }

    @Test
    void aBorrowedItemCancelledAtItsDeadlineGivesItsWorkerBack() throws Exception {
        try (ComputePool pool = new ComputePool(2, 4, 30_000)) {
            Held onShare = new Held("share");
            var shareReply = pool.submitBatchItem(onShare, PROBLEM, deadline(pool), true, true);
            assertTrue(onShare.hasStarted());
            Held late = new Held("late");
            var borrowed = pool.submitBatchItem(late, PROBLEM, System.nanoTime() + 50_000_000L, false, true);
            assertNotNull(borrowed);
            assertTrue(late.hasStarted());
            String reply = borrowed.await(); // past its deadline: cancelled, the worker interrupted
            assertTrue(reply.startsWith("problem:"), reply);
            // The cancelled item gave its claim back once its worker stopped: the idle worker may be borrowed.
            Held next = new Held("next");
            ComputePool.Pending<String> again = null;
            for (int i = 0; i < 1000 && again == null; i++) {
                again = pool.submitBatchItem(next, PROBLEM, deadline(pool), false, true);
                if (again == null) {
                    Thread.onSpinWait();
                    Thread.sleep(1);
                }
            }
            assertNotNull(again, "the claim of the cancelled item was released");
            assertTrue(next.hasStarted());
            assertFalse(next.release.getCount() == 0);
            next.release.countDown();
            onShare.release.countDown();
            assertEquals("next", again.await());
            assertEquals("share", shareReply.await());
        }
    }
}
