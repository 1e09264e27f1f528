package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.exchange.Outcome;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.observe.RequestIds;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Future;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.SynchronousQueue;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Function;
import java.util.function.Supplier;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.MDC;

/**
 * The bounded pool every design computation runs on: a fixed number of worker threads and a bounded queue.
 * A computation that cannot be queued is refused at once (503, back-pressure); one that does not finish within
 * the compute deadline is answered with 504 while the worker completes it in the background (the solver's
 * loops are all capped, so a worker is never lost).
 */
public final class ComputePool implements AutoCloseable {

    /** Retry-After seconds suggested to a refused client. */
    public static final int RETRY_AFTER_SECONDS = 1;
    private static final Logger LOG = LoggerFactory.getLogger(ComputePool.class);

    private final ThreadPoolExecutor executor;
    private final long deadlineMillis;
    private final ObjectMapper mapper;

    public ComputePool(int workerThreads, int queueCapacity, long deadlineMillis, ObjectMapper mapper) {
        BlockingQueue<Runnable> queue = queueCapacity == 0 ? new SynchronousQueue<>()
                : new ArrayBlockingQueue<>(queueCapacity);
        AtomicInteger count = new AtomicInteger();
        ThreadFactory threads = task -> {
            Thread thread = new Thread(task, "loopwright-design-" + count.incrementAndGet());
            thread.setDaemon(true);
            return thread;
        };
        this.executor = new ThreadPoolExecutor(workerThreads, workerThreads, 0, TimeUnit.MILLISECONDS, queue,
                threads, new ThreadPoolExecutor.AbortPolicy());
        this.deadlineMillis = deadlineMillis;
        this.mapper = mapper;
    }

    /**
     * Runs one computation on the pool and waits for it up to the deadline. Never throws: refusal, deadline
     * and unexpected failures are outcomes with a problem.
     */
    public Outcome run(Supplier<Outcome> computation) {
        return run(computation, this::failure);
    }

    /**
     * The same for any result type: {@code onProblem} turns a refusal, a missed deadline or a failure into a
     * result of that type.
     */
    public <T> T run(Supplier<T> computation, Function<Problem, T> onProblem) {
        return submit(computation, onProblem).await();
    }

    /**
     * Queues one computation and returns at once; {@link Pending#await} waits for it up to the deadline counted
     * from this call. A refusal (every worker busy and the queue full) is a pending result that is already
     * resolved to the overloaded problem. Lets a caller keep several computations in flight (a batch).
     */
    public <T> Pending<T> submit(Supplier<T> computation, Function<Problem, T> onProblem) {
        long submittedNanos = System.nanoTime();
        // The request id follows the computation onto the worker thread (the only diagnostic context the service
        // sets; carrying one string avoids copying the whole context map per computation).
        String requestId = MDC.get(RequestIds.MDC_KEY);
        try {
            Future<T> future = executor.submit(() -> {
                if (requestId != null) {
                    MDC.put(RequestIds.MDC_KEY, requestId);
                }
                try {
                    return computation.get();
                } finally {
                    MDC.remove(RequestIds.MDC_KEY);
                }
            });
            return new Pending<>(future, submittedNanos, onProblem, null);
        } catch (RejectedExecutionException e) {
            return new Pending<>(null, submittedNanos, onProblem, onProblem.apply(ProblemType.SERVICE_OVERLOADED
                    .problem("all " + executor.getMaximumPoolSize() + " design workers are busy and "
                            + queueCapacity() + " designs are queued; retry after " + RETRY_AFTER_SECONDS + " s")));
        }
    }

    /** One submitted computation: its result, or the problem of a refusal, a missed deadline or a failure. */
    public final class Pending<T> {
        private final Future<T> future;
        private final long submittedNanos;
        private final Function<Problem, T> onProblem;
        private final T refused;

        private Pending(Future<T> future, long submittedNanos, Function<Problem, T> onProblem, T refused) {
            this.future = future;
            this.submittedNanos = submittedNanos;
            this.onProblem = onProblem;
            this.refused = refused;
        }

        /** True when the pool refused the computation (the result is the overloaded problem). */
        public boolean refused() {
            return future == null;
        }

        /** True when {@link #await} would return without waiting. */
        public boolean isDone() {
            return future == null || future.isDone();
        }

        /**
         * Waits up to {@code nanos} (and never past the deadline) for the computation to finish; returns whether it
         * has. Never throws; {@link #await} then gives the result or the problem.
         */
        public boolean awaitDone(long nanos) {
            if (future == null || future.isDone()) {
                return true;
            }
            long remainingNanos = TimeUnit.MILLISECONDS.toNanos(deadlineMillis) - (System.nanoTime() - submittedNanos);
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

        /** The result, waiting at most until the compute deadline after submission. Never throws. */
        public T await() {
            if (future == null) {
                return refused;
            }
            long remainingNanos = TimeUnit.MILLISECONDS.toNanos(deadlineMillis) - (System.nanoTime() - submittedNanos);
            try {
                return future.get(Math.max(0, remainingNanos), TimeUnit.NANOSECONDS);
            } catch (TimeoutException e) {
                future.cancel(true);
                return onProblem.apply(ProblemType.DEADLINE_EXCEEDED.problem("the design did not finish within the "
                        + "compute deadline of " + deadlineMillis + " ms"));
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                future.cancel(true);
                return onProblem.apply(ProblemType.NOT_READY.problem("the request was interrupted by a shutdown"));
            } catch (ExecutionException e) {
                LOG.error("design computation failed", e.getCause());
                return onProblem.apply(ProblemType.INTERNAL_ERROR.problem(null));
            } catch (java.util.concurrent.CancellationException e) {
                return onProblem.apply(ProblemType.NOT_READY.problem("the computation was cancelled by a shutdown"));
            }
        }

        /** Gives up on the computation (the worker may still finish it; every solver loop is capped). */
        public void cancel() {
            if (future != null) {
                future.cancel(true);
            }
        }
    }

    /** True when a new computation would be refused right now (every worker busy and the queue full). */
    public boolean saturated() {
        return executor.getActiveCount() >= executor.getMaximumPoolSize() && executor.getQueue().remainingCapacity() == 0;
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

    private int queueCapacity() {
        return executor.getQueue().size() + executor.getQueue().remainingCapacity();
    }

    private Outcome failure(Problem problem) {
        return new Outcome(problem.status(), mapper.valueToTree(problem), problem);
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
