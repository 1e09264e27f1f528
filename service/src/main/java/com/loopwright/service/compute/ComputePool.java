package com.loopwright.service.compute;

import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.observe.RequestIds;
import com.loopwright.solver.cancel.ComputationCancelledException;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Future;
import java.util.concurrent.FutureTask;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.Semaphore;
import java.util.concurrent.SynchronousQueue;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Consumer;
import java.util.function.Function;
import java.util.function.LongConsumer;
import java.util.function.Supplier;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.MDC;

/**
 * The bounded pool every design computation runs on: a fixed number of worker threads and a bounded queue.
 * A computation that cannot be queued is refused at once (503, back-pressure); one that does not finish by its
 * deadline is answered with 504 and cancelled: its worker is interrupted, and the solver's long loops stop at their
 * next cancellation checkpoint.
 *
 * <p>Batches ({@link BatchLane}) hold at most {@link #batchShare()} workers (ceil(workers/2)) across all batches
 * at any time, so that single requests always find the other workers. Beyond that share, a batch may borrow a worker
 * for a short item (the caller says which), but only one that is idle while nothing waits in the queue: it starts at
 * once and never queues ahead of a single request. A worker a batch holds goes on with the batch's next item only
 * while nothing is queued, so a single request arriving later waits at most for one item to end on a borrowed
 * worker (a short one). The pool counts its claims (computations queued or running, a worker a batch holds as
 * one) itself, so that the borrow rule is one atomic step.
 */
public final class ComputePool implements AutoCloseable {

    /** Retry-After seconds suggested to a refused client. */
    public static final int RETRY_AFTER_SECONDS = 1;

    private static final Logger LOG = LoggerFactory.getLogger(ComputePool.class);

    private final ThreadPoolExecutor executor;
    private final long deadlineMillis;
    /** Workers batch items may hold at once, over all batches: ceil(workers/2). */
    private final int batchShare;

    private final Semaphore batchSlots;
    /** Computations queued or running: counted from submission until they end or are cancelled unstarted. */
    private final AtomicInteger claims = new AtomicInteger();

    private final Timings timings;

    /**
     * Sees how long each computation waited in the queue and how long it kept its worker (nanoseconds; a
     * computation cancelled while queued is not seen).
     */
    public record Timings(LongConsumer queueWaitNanos, LongConsumer computeNanos) {
        public static final Timings NONE = new Timings(nanos -> {}, nanos -> {});
    }

    public ComputePool(int workerThreads, int queueCapacity, long deadlineMillis) {
        this(workerThreads, queueCapacity, deadlineMillis, Timings.NONE);
    }

    public ComputePool(int workerThreads, int queueCapacity, long deadlineMillis, Timings timings) {
        this.timings = timings;
        BlockingQueue<Runnable> queue =
                queueCapacity == 0 ? new SynchronousQueue<>() : new ArrayBlockingQueue<>(queueCapacity);
        AtomicInteger count = new AtomicInteger();
        ThreadFactory threads = task -> {
            Thread thread = new Thread(task, "loopwright-design-" + count.incrementAndGet());
            thread.setDaemon(true);
            return thread;
        };
        this.executor = new ThreadPoolExecutor(
                workerThreads,
                workerThreads,
                0,
                TimeUnit.MILLISECONDS,
                queue,
                threads,
                new ThreadPoolExecutor.AbortPolicy());
        this.deadlineMillis = deadlineMillis;
        this.batchShare = (workerThreads + 1) / 2;
        this.batchSlots = new Semaphore(batchShare, true);
    }

    /** The deadline of a request that starts now, as a {@link System#nanoTime()} instant. */
    public long deadlineFromNow() {
        return System.nanoTime() + TimeUnit.MILLISECONDS.toNanos(deadlineMillis);
    }

    /**
     * Runs one computation on the pool and waits for it up to the deadline. Never throws: {@code onProblem} turns
     * a refusal, a missed deadline or an unexpected failure into a result of the computation's type.
     */
    public <T> T run(Supplier<T> computation, Function<Problem, T> onProblem) {
        return submit(computation, onProblem).await();
    }

    /**
     * Queues one computation and returns at once; {@link Pending#await} waits for it up to the deadline counted
     * from this call. A refusal (every worker busy and the queue full) is a pending result that is already
     * resolved to the overloaded problem.
     */
    public <T> Pending<T> submit(Supplier<T> computation, Function<Problem, T> onProblem) {
        claims.incrementAndGet();
        return submit(computation, onProblem, deadlineFromNow(), once(claims::decrementAndGet));
    }

    /** A new batch's items, computed under its deadline (one deadline covers all its items): {@link BatchLane}. */
    public <T> BatchLane<T> batchLane(Function<Problem, T> onProblem, long deadlineNanos) {
        return new BatchLane<>(this, onProblem, deadlineNanos);
    }

    /** How a batch holds a worker: on the batch share, or borrowed beyond it while the worker was idle. */
    enum Grant {
        SHARE,
        BORROWED
    }

    /**
     * A worker for a batch without waiting: a free slot of the {@link #batchShare()}, else, for a short item, an
     * idle worker borrowed when fewer computations than workers are queued or running (a worker is idle and
     * nothing is queued; one atomic step, so two batches never borrow the same worker); else null.
     */
    Grant claim(boolean shortItem) {
        if (batchSlots.tryAcquire()) {
            claims.incrementAndGet();
            return Grant.SHARE;
        }
        int workers = executor.getMaximumPoolSize();
        for (int claimed = claims.get(); shortItem && claimed < workers; claimed = claims.get()) {
            if (claims.compareAndSet(claimed, claimed + 1)) {
                return Grant.BORROWED;
            }
        }
        return null;
    }

    /** A slot of the batch share, waiting at most {@code nanos}; null when none came free. */
    Grant claimShare(long nanos) throws InterruptedException {
        if (nanos <= 0 || !batchSlots.tryAcquire(nanos, TimeUnit.NANOSECONDS)) {
            return null;
        }
        claims.incrementAndGet();
        return Grant.SHARE;
    }

    /** Gives a worker held by a batch back. */
    void release(Grant grant) {
        claims.decrementAndGet();
        if (grant == Grant.SHARE) {
            batchSlots.release();
        }
    }

    /**
     * Whether a worker a batch holds may go on with the batch's next item without giving the worker back: only while
     * no computation is queued (single requests keep priority), before the deadline, with the pool running, and,
     * on a borrowed worker, only for a short item.
     */
    boolean mayContinue(Grant grant, boolean shortItem, long deadlineNanos) {
        return (grant == Grant.SHARE || shortItem)
                && claims.get() <= executor.getMaximumPoolSize()
                && deadlineNanos - System.nanoTime() > 0
                && !executor.isShutdown();
    }

    /** Runs {@code work} on a worker; false when the pool refuses it (every worker busy and the queue full). */
    boolean execute(Runnable work) {
        try {
            executor.execute(work);
            return true;
        } catch (RejectedExecutionException e) {
            return false;
        }
    }

    /** Runs {@code release} the first time only (a task cancelled as it starts may reach both release points). */
    private static Runnable once(Runnable release) {
        AtomicBoolean pending = new AtomicBoolean(true);
        return () -> {
            if (pending.compareAndSet(true, false)) {
                release.run();
            }
        };
    }

    /**
     * @param release runs once the computation has ended, was refused, or was cancelled before it started
     */
    private <T> Pending<T> submit(
            Supplier<T> computation, Function<Problem, T> onProblem, long deadlineNanos, Runnable release) {
        if (deadlineNanos - System.nanoTime() <= 0) {
            release.run();
            return new Pending<>(null, deadlineNanos, onProblem, onProblem.apply(deadlineProblem()));
        }
        Task<T> task = task(computation, release, ended -> {});
        if (execute(task)) {
            return new Pending<>(task, deadlineNanos, onProblem, null);
        }
        release.run();
        return new Pending<>(null, deadlineNanos, onProblem, onProblem.apply(overloadedProblem()));
    }

    /**
     * One computation to run (by the executor, or by a worker a batch holds): it carries the request id onto the
     * worker and reports its timings.
     *
     * @param release runs once the computation has ended or was cancelled before it started
     * @param ended   sees the task once its result is set (computed, failed, cancelled or refused)
     */
    <T> Task<T> task(Supplier<T> computation, Runnable release, Consumer<Future<?>> ended) {
        // The request id follows the computation onto the worker thread (the only diagnostic context the service
        // sets; carrying one string avoids copying the whole context map per computation).
        String requestId = MDC.get(RequestIds.MDC_KEY);
        AtomicBoolean started = new AtomicBoolean();
        long queuedNanos = System.nanoTime();
        return new Task<T>(() -> {
            started.set(true);
            long startedNanos = System.nanoTime();
            timings.queueWaitNanos().accept(startedNanos - queuedNanos);
            if (requestId != null) {
                MDC.put(RequestIds.MDC_KEY, requestId);
            }
            try {
                return computation.get();
            } finally {
                timings.computeNanos().accept(System.nanoTime() - startedNanos);
                MDC.remove(RequestIds.MDC_KEY);
                release.run();
            }
        }) {
            @Override
            protected void done() {
                if (!started.get()) {
                    release.run(); // cancelled while queued: the computation never runs
                }
                ended.accept(this);
            }
        };
    }

    /** A computation's future, which a batch may also resolve to a refusal without running it. */
    static class Task<T> extends FutureTask<T> {
        Task(java.util.concurrent.Callable<T> computation) {
            super(computation);
        }

        /** Resolves a computation that will not run (refused by a full pool) to {@code refusal}. */
        void refuse(T refusal) {
            set(refusal);
        }
    }

    Problem overloadedProblem() {
        return ProblemType.SERVICE_OVERLOADED.problem("all " + executor.getMaximumPoolSize()
                + " design workers are busy and " + queueCapacity() + " designs are queued; retry after "
                + RETRY_AFTER_SECONDS + " s");
    }

    Problem deadlineProblem() {
        return ProblemType.DEADLINE_EXCEEDED.problem("the computation did not finish within the compute deadline of "
                + deadlineMillis + " ms (one deadline covers every item of a batch)");
    }

    /** One submitted computation: its result, or the problem of a refusal, a missed deadline or a failure. */
    public final class Pending<T> {
        private final Future<T> future;
        private final long deadlineNanos;
        private final Function<Problem, T> onProblem;
        private final T refused;

        Pending(Future<T> future, long deadlineNanos, Function<Problem, T> onProblem, T refused) {
            this.future = future;
            this.deadlineNanos = deadlineNanos;
            this.onProblem = onProblem;
            this.refused = refused;
        }

        /** True once {@link #await} returns without waiting. */
        boolean isDone() {
            return future == null || future.isDone();
        }

        /** The computation's future (null when it was never queued). */
        Future<T> future() {
            return future;
        }

        /**
         * Waits up to {@code nanos} (and never past the deadline) for the computation to finish; returns whether it
         * has. Never throws; {@link #await} then gives the result or the problem.
         */
        public boolean awaitDone(long nanos) {
            if (future == null || future.isDone()) {
                return true;
            }
            long remainingNanos = deadlineNanos - System.nanoTime();
            try {
                future.get(Math.max(0, Math.min(nanos, remainingNanos)), TimeUnit.NANOSECONDS);
                return true;
            } catch (TimeoutException e) {
                return false;
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return future.isDone();
            } catch (ExecutionException | java.util.concurrent.CancellationException e) {
                return true;
            }
        }

        /** The result, waiting at most until the deadline. Never throws. */
        public T await() {
            if (future == null) {
                return refused;
            }
            long remainingNanos = deadlineNanos - System.nanoTime();
            try {
                return future.get(Math.max(0, remainingNanos), TimeUnit.NANOSECONDS);
            } catch (TimeoutException e) {
                future.cancel(true); // interrupts the worker: the solver stops at its next checkpoint
                return onProblem.apply(deadlineProblem());
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                future.cancel(true);
                return onProblem.apply(ProblemType.NOT_READY.problem("the request was interrupted by a shutdown"));
            } catch (ExecutionException e) {
                if (e.getCause() instanceof ComputationCancelledException) {
                    return onProblem.apply(
                            ProblemType.NOT_READY.problem("the computation was cancelled by a shutdown"));
                }
                LOG.error("design computation failed", e.getCause());
                return onProblem.apply(ProblemType.INTERNAL_ERROR.problem(null));
            } catch (java.util.concurrent.CancellationException e) {
                return onProblem.apply(ProblemType.NOT_READY.problem("the computation was cancelled by a shutdown"));
            }
        }

        /** Gives up on the computation: a queued one never runs, a running one is interrupted. */
        public void cancel() {
            if (future != null) {
                future.cancel(true);
            }
        }
    }

    /** True when a new computation would be refused right now (every worker busy and the queue full). */
    public boolean saturated() {
        return executor.getActiveCount() >= executor.getMaximumPoolSize()
                && executor.getQueue().remainingCapacity() == 0;
    }

    public int activeWorkers() {
        return executor.getActiveCount();
    }

    public int queuedDesigns() {
        return executor.getQueue().size();
    }

    public int workerThreads() {
        return executor.getMaximumPoolSize();
    }

    public long deadlineMillis() {
        return deadlineMillis;
    }

    /** Workers all batches together may hold at once: ceil(workers/2); single requests keep the rest. */
    public int batchShare() {
        return batchShare;
    }

    private int queueCapacity() {
        return executor.getQueue().size() + executor.getQueue().remainingCapacity();
    }

    /** Stops taking work and lets queued computations finish, waiting at most the given time. */
    public void shutdown(long graceMillis) {
        executor.shutdown();
        try {
            if (!executor.awaitTermination(graceMillis, TimeUnit.MILLISECONDS)) {
                executor.shutdownNow();
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            executor.shutdownNow();
        }
    }

    @Override
    public void close() {
        shutdown(0);
    }
}
