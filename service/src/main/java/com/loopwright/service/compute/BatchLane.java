package com.loopwright.service.compute;

import com.loopwright.api.problem.Problem;
import java.util.ArrayDeque;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.function.Function;
import java.util.function.Supplier;

/**
 * The items of one batch on the pool, in request order. The batch's writer adds items ({@link #add}, each a
 * {@link ComputePool.Pending} at once) and keeps workers on them ({@link #serve}); a worker the batch holds computes
 * the lane's items one after another, so that it does not wait for the writer between items, and gives the worker
 * back when the lane is empty or when it may not go on ({@link ComputePool#mayContinue}: something is queued, the
 * deadline has passed, or the next item is not short and the worker is borrowed). The writer alone adds items and
 * starts workers; workers take the items (the writer takes one only to answer it as overloaded when the pool
 * refuses to start a worker and the batch holds none). The lane holds at most the writer's window of items.
 */
public final class BatchLane<T> {

    /** Longest wait for a slot of the share before the awaited item is looked at again [ns]. */
    private static final long SLOT_WAIT_STEP_NANOS = 50_000_000L;

    private final ComputePool pool;
    private final Function<Problem, T> onProblem;
    private final long deadlineNanos;

    /** Items added and not yet taken by a worker, in request order. Guarded by this. */
    private final ArrayDeque<Item<T>> waiting = new ArrayDeque<>();
    /** Workers this batch holds. Guarded by this. */
    private int workers;
    /** Of those, workers started that have not yet taken their first item. Guarded by this. */
    private int starting;
    /** The item the writer is waiting for, if it is waiting. Guarded by this. */
    private Future<?> awaited;

    private record Item<T>(ComputePool.Task<T> task, boolean shortItem) {}

    BatchLane(ComputePool pool, Function<Problem, T> onProblem, long deadlineNanos) {
        this.pool = pool;
        this.onProblem = onProblem;
        this.deadlineNanos = deadlineNanos;
    }

    /**
     * Adds the batch's next item; it is computed once a worker of the batch reaches it ({@link #serve}). Past the
     * deadline it is not computed: the result is the deadline problem at once.
     *
     * @param shortItem true for an item whose estimate allows it a worker borrowed beyond the batch share
     */
    public ComputePool.Pending<T> add(Supplier<T> computation, boolean shortItem) {
        if (deadlineNanos - System.nanoTime() <= 0) {
            return pool.new Pending<>(null, deadlineNanos, onProblem, onProblem.apply(pool.deadlineProblem()));
        }
        // The worker's claim is the lane's to give back; the writer waiting for this item is woken when it ends.
        ComputePool.Task<T> task = pool.task(computation, () -> {}, this::ended);
        synchronized (this) {
            waiting.addLast(new Item<>(task, shortItem));
        }
        return pool.new Pending<>(task, deadlineNanos, onProblem, null);
    }

    /**
     * Puts workers on the waiting items: each worker the pool grants at once (a slot of the batch share, or an idle
     * worker borrowed for a short item). When the batch holds no worker and items wait, it waits up to
     * {@code waitNanos} for a slot of the share, so the batch always progresses on its share. When the pool
     * refuses the work (full queue) while the batch holds no worker, the oldest waiting item is answered with the
     * overloaded problem, as a single request would be.
     */
    public void serve(long waitNanos) {
        while (deadlineNanos - System.nanoTime() > 0) { // past the deadline no item starts
            boolean shortHead;
            boolean held;
            synchronized (this) {
                Item<T> head = waiting.peekFirst();
                if (head == null || waiting.size() <= starting) {
                    return; // every waiting item has a worker on its way
                }
                shortHead = head.shortItem();
                held = workers > 0;
            }
            ComputePool.Grant grant = pool.claim(shortHead);
            if (grant == null && !held) {
                try {
                    grant = pool.claimShare(Math.min(waitNanos, deadlineNanos - System.nanoTime()));
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    return;
                }
            }
            if (grant == null) {
                return;
            }
            synchronized (this) {
                workers++;
                starting++;
            }
            if (!start(grant)) {
                return;
            }
        }
    }

    /**
     * Waits up to {@code nanos} (never past the deadline) for {@code item}, an item of this lane, to end; returns
     * whether it has. Woken when the item ends (computed, failed, cancelled by a cut or refused) and when the lane
     * has items waiting but its last worker was given back: it then asks for a worker ({@link #serve}), waiting for
     * a slot of the share within the same time.
     */
    public boolean awaitDone(ComputePool.Pending<T> item, long nanos) {
        long endNanos = System.nanoTime() + Math.min(nanos, deadlineNanos - System.nanoTime());
        while (true) {
            synchronized (this) {
                awaited = item.future();
                try {
                    while (!item.isDone() && (workers > 0 || waiting.isEmpty())) {
                        long leftNanos = endNanos - System.nanoTime();
                        if (leftNanos <= 0) {
                            return false;
                        }
                        TimeUnit.NANOSECONDS.timedWait(this, leftNanos);
                    }
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    return item.isDone();
                } finally {
                    awaited = null;
                }
                if (item.isDone()) {
                    return true;
                }
            }
            long leftNanos = endNanos - System.nanoTime();
            if (leftNanos <= 0) {
                return false;
            }
            // Items wait and the batch holds no worker: ask for one, waiting for a slot of the share at most a
            // step at a time so that an item cancelled meanwhile (a shutdown cut) ends this wait soon.
            serve(Math.min(leftNanos, SLOT_WAIT_STEP_NANOS));
        }
    }

    /** A task of this lane has ended: wake the writer if it waits for that one. */
    private synchronized void ended(Future<?> task) {
        if (task == awaited) {
            notifyAll();
        }
    }

    /** Workers this batch holds now (for tests). */
    synchronized int workersHeld() {
        return workers;
    }

    private boolean start(ComputePool.Grant grant) {
        if (pool.execute(() -> compute(grant))) {
            return true;
        }
        pool.release(grant);
        Item<T> refused = null;
        synchronized (this) {
            workers--;
            starting--;
            if (workers == 0) {
                refused = waiting.pollFirst();
            }
        }
        if (refused != null) {
            refused.task().refuse(onProblem.apply(pool.overloadedProblem()));
        }
        return false;
    }

    /** On a worker the batch holds: the waiting items one after another, while the pool lets it go on. */
    private void compute(ComputePool.Grant grant) {
        boolean holding = true;
        try {
            Item<T> item = first(grant);
            while (item != null) {
                item.task().run(); // never throws: the outcome is the task's
                Thread.interrupted(); // an interrupt that cancelled this item is not the next one's
                item = next(grant);
            }
            holding = false;
        } finally {
            if (holding) {
                synchronized (this) {
                    givenBack();
                }
            }
            pool.release(grant);
        }
    }

    /** The first item for a worker just granted (a borrowed one only takes a short item), before the deadline. */
    private synchronized Item<T> first(ComputePool.Grant grant) {
        starting--;
        Item<T> head = waiting.peekFirst();
        if (head != null
                && (grant == ComputePool.Grant.SHARE || head.shortItem())
                && deadlineNanos - System.nanoTime() > 0) {
            return waiting.pollFirst();
        }
        givenBack();
        return null;
    }

    /** The next item for a worker that has finished one, or null once it must give the worker back. */
    private synchronized Item<T> next(ComputePool.Grant grant) {
        Item<T> head = waiting.peekFirst();
        if (head != null && pool.mayContinue(grant, head.shortItem(), deadlineNanos)) {
            return waiting.pollFirst();
        }
        givenBack();
        return null;
    }

    /** A worker is given back; with none left while items wait, the writer must ask for one again. */
    private void givenBack() {
        workers--;
        if (workers == 0 && !waiting.isEmpty() && awaited != null) {
            notifyAll();
        }
    }
}
