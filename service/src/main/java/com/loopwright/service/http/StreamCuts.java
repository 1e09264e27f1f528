package com.loopwright.service.http;

import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Ends long responses (batch streams) in time when the service stops: shortly before the shutdown grace period runs
 * out, every open stream is told to write its final line and finish, so that the client gets a well-formed end
 * saying why, instead of a connection closed in the middle of a chunked body.
 */
public final class StreamCuts {

    /** Streams are cut this long before the grace period ends (at most half of it), for the last line to go out. */
    public static final long CUT_MARGIN_MILLIS = 1_000;

    private final Set<Stream> open = ConcurrentHashMap.newKeySet();
    private volatile boolean cutting;

    /** Registers a stream; close it when the response is finished. */
    public Stream open() {
        Stream stream = new Stream();
        open.add(stream);
        if (cutting) {
            stream.cut();
        }
        return stream;
    }

    /** Cuts every open stream (and any opened later) now. */
    public void cutAll() {
        cutting = true;
        open.forEach(Stream::cut);
    }

    /** Cuts every open stream {@link #CUT_MARGIN_MILLIS} (at most half the grace) before the grace period ends. */
    public void cutBefore(long graceMillis) {
        long delayMillis = Math.max(graceMillis / 2, graceMillis - CUT_MARGIN_MILLIS);
        Thread timer = new Thread(
                () -> {
                    try {
                        Thread.sleep(delayMillis);
                        cutAll();
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                    }
                },
                "loopwright-stream-cut");
        timer.setDaemon(true);
        timer.start();
    }

    /** One open stream: whether it was cut, and what to cancel so that a waiting writer wakes up. */
    public final class Stream implements AutoCloseable {
        private volatile boolean cut;
        private volatile Runnable waitingFor;

        public boolean isCut() {
            return cut;
        }

        /** The writer is about to wait for this computation; a cut cancels it so that the wait ends at once. */
        public void waitingFor(Runnable cancel) {
            waitingFor = cancel;
            if (cut) {
                cancel.run();
            }
        }

        void cut() {
            cut = true;
            Runnable cancel = waitingFor;
            if (cancel != null) {
                cancel.run();
            }
        }

        @Override
        public void close() {
            open.remove(this);
        }
    }
}
