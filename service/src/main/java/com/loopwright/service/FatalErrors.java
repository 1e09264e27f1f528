package com.loopwright.service;

import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.BiFunction;
import java.util.function.Function;
import java.util.function.IntConsumer;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * A process that ran out of memory is alive but sick (threads died half-way, caches half-filled): it must exit so
 * that the orchestrator restarts it. The JVM flag -XX:+ExitOnOutOfMemoryError does this for every thread; this
 * class does the same where the application sees the error (a request, the error handler, an uncaught failure),
 * for a JVM started without the flag. Every other uncaught failure becomes one log line (one JSON object in the
 * JSON format), never a plain-text stack trace on the console.
 */
public final class FatalErrors implements Thread.UncaughtExceptionHandler {

    /** Exit status after an OutOfMemoryError (the JVM's own ExitOnOutOfMemoryError uses 3 as well). */
    public static final int OUT_OF_MEMORY_EXIT_STATUS = 3;
    /** Causes followed when looking for an OutOfMemoryError. */
    static final int MAX_CAUSE_DEPTH = 16;

    private static final Logger LOG = LoggerFactory.getLogger(FatalErrors.class);

    private final IntConsumer halt;
    private final AtomicBoolean halting = new AtomicBoolean();

    /** @param halt ends the process with the given status (Runtime.halt in production) */
    public FatalErrors(IntConsumer halt) {
        this.halt = halt;
    }

    /** Halts the JVM at once: shutdown hooks could need the memory that is missing. */
    public static FatalErrors haltingTheJvm() {
        return new FatalErrors(status -> Runtime.getRuntime().halt(status));
    }

    /** True when {@code failure} or one of its causes is an OutOfMemoryError. */
    public static boolean isOutOfMemory(Throwable failure) {
        Throwable current = failure;
        for (int depth = 0; current != null && depth < MAX_CAUSE_DEPTH; depth++) {
            if (current instanceof OutOfMemoryError) {
                return true;
            }
            current = current.getCause();
        }
        return false;
    }

    /** Ends the process when {@code failure} is an OutOfMemoryError; returns whether it was one. */
    public boolean check(Throwable failure) {
        if (!isOutOfMemory(failure)) {
            return false;
        }
        if (halting.compareAndSet(false, true)) {
            // No stack trace: building it needs memory, and the message says all that matters.
            LOG.error(
                    "out of memory ({}): exiting with status {} so that the service is restarted",
                    failure.getMessage(),
                    OUT_OF_MEMORY_EXIT_STATUS);
            halt.accept(OUT_OF_MEMORY_EXIT_STATUS);
        }
        return true;
    }

    /** The function, handing an OutOfMemoryError it throws (on a worker thread) to {@link #check} first. */
    public <T, R> Function<T, R> guard(Function<T, R> work) {
        return input -> {
            try {
                return work.apply(input);
            } catch (OutOfMemoryError e) {
                check(e);
                throw e;
            }
        };
    }

    /** The same for a two-argument function. */
    public <T, U, R> BiFunction<T, U, R> guard(BiFunction<T, U, R> work) {
        return (first, second) -> {
            try {
                return work.apply(first, second);
            } catch (OutOfMemoryError e) {
                check(e);
                throw e;
            }
        };
    }

    @Override
    public void uncaughtException(Thread thread, Throwable failure) {
        if (!check(failure)) {
            LOG.error("uncaught failure on thread {}", thread.getName(), failure);
        }
    }
}
