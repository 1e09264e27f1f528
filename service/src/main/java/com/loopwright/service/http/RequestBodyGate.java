package com.loopwright.service.http;

import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import java.nio.ByteBuffer;
import java.util.Arrays;
import java.util.Map;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicBoolean;
import org.eclipse.jetty.http.HttpException;
import org.eclipse.jetty.http.HttpFields;
import org.eclipse.jetty.http.HttpHeader;
import org.eclipse.jetty.io.Content;
import org.eclipse.jetty.server.Handler;
import org.eclipse.jetty.server.Request;
import org.eclipse.jetty.server.Response;
import org.eclipse.jetty.util.Callback;
import org.eclipse.jetty.util.thread.Scheduler;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Admits and reads request bodies before the application sees them, so that no request thread waits on a slow
 * client and the heap never holds more bodies than a fixed budget.
 * <ol>
 *   <li>A request that fails the header-only admission test (on a keyed route: no accepted API key) reserves
 *       nothing: its body is read and dropped, and the request goes on without it (marked {@link #WITHHELD}), so
 *       that the application answers it (401/403) as it would any other. With {@code Expect: 100-continue}, or a
 *       body over {@link #DRAIN_FACTOR} request caps, nothing is read and the connection closes after the
 *       answer.</li>
 *   <li>A body longer than the request cap is refused with 413 at once (with {@code Expect: 100-continue}, before
 *       the client sends it).</li>
 *   <li>Each body reserves its Content-Length (a chunked body: the request cap) from the in-flight byte budget
 *       before a byte is read; when the budget is spent the request gets 503 with Retry-After. The reservation is
 *       held until the response is complete, because parsing and serving a body costs a multiple of its size.</li>
 *   <li>The body is read asynchronously (Jetty calls back when bytes arrive; no thread waits). After a grace
 *       period it must have arrived at an average of at least the minimum rate since the read began, else
 *       408.</li>
 *   <li>A body that cannot be read (bad chunk framing, connection closed mid-body) is a 400 problem and one
 *       WARN line without a stack trace.</li>
 * </ol>
 * Only then is the request handed on, with the whole body in memory, to a request thread. Every request this gate
 * answers itself is reported to the {@link Observer} (the application never sees it).
 */
public final class RequestBodyGate extends Handler.Wrapper {

    /** Seconds a client refused for the body budget is asked to wait. */
    public static final int RETRY_AFTER_SECONDS = 1;
    /** First buffer of a chunked body; it doubles up to the request cap. */
    static final int FIRST_CHUNKED_BUFFER_BYTES = 8 * 1024;
    /** Longest method or path echoed in a log line. */
    static final int MAX_LOGGED_CHARS = 120;
    /** Refused bodies up to this many request caps are read and dropped before the answer; larger ones are cut. */
    static final long DRAIN_FACTOR = 4;
    /** Request attribute (Boolean.TRUE) of a request handed on without its body: it failed the admission test. */
    public static final String WITHHELD = "loopwright.bodyWithheld";

    private static final Logger LOG = LoggerFactory.getLogger(RequestBodyGate.class);
    private static final ByteBuffer NO_BYTES = ByteBuffer.allocate(0);

    /** The header-only test a request with a body must pass before any of the body is admitted. */
    @FunctionalInterface
    public interface Admission {
        /** True when the body may reserve budget and be read; false withholds it (see the class comment). */
        boolean admits(Request request);
    }

    /** Told what the gate refuses and answers. */
    public interface Observer {
        /** A body refused, by reason: "too_large", "budget", "slow" or "unreadable". */
        void bodyRefused(String reason);

        /** The gate answered a request itself (status, time since the gate saw it); the path is the raw path. */
        void answered(String method, String path, int status, long elapsedNanos);
    }

    private final long maxBodyBytes;
    private final long budgetBytes;
    private final Semaphore budget;
    private final long minBytesPerSecond;
    private final long graceNanos;
    private final CoreProblems problems;
    private final Admission admission;
    private final Observer observer;

    /**
     * @param admission the header-only test run before a body is admitted (e.g. the API key of a keyed route)
     * @param observer  told of every refused body and every request answered here
     */
    public RequestBodyGate(
            long maxBodyBytes, HttpLimits limits, CoreProblems problems, Admission admission, Observer observer) {
        this.maxBodyBytes = maxBodyBytes;
        this.budgetBytes = limits.inFlightBodyBytes();
        this.budget = new Semaphore(Math.toIntExact(budgetBytes));
        this.minBytesPerSecond = limits.minBodyBytesPerSecond();
        this.graceNanos = TimeUnit.MILLISECONDS.toNanos(limits.bodyGraceMillis());
        this.problems = problems;
        this.admission = admission;
        this.observer = observer;
    }

    /** Bytes of the in-flight body budget not reserved right now. */
    public long availableBodyBytes() {
        return budget.availablePermits();
    }

    @Override
    public boolean handle(Request request, Response response, Callback callback) throws Exception {
        Handler next = getHandler();
        if (next == null) {
            return false;
        }
        HttpFields headers = request.getHeaders();
        long declared = headers.getLongField(HttpHeader.CONTENT_LENGTH);
        // HTTP/1.1 frames a body by Content-Length or chunked transfer coding (Jetty refuses any other coding).
        boolean chunked = declared < 0 && headers.contains(HttpHeader.TRANSFER_ENCODING);
        if (declared <= 0 && !chunked) {
            return next.handle(request, response, callback);
        }
        long startNanos = System.nanoTime();
        if (!admission.admits(request)) {
            withhold(next, request, response, callback, declared, startNanos);
            return true;
        }
        if (declared > maxBodyBytes) {
            refuse(
                    request,
                    response,
                    callback,
                    startNanos,
                    declared,
                    "too_large",
                    ProblemType.PAYLOAD_TOO_LARGE.problem("the body of " + declared
                            + " bytes exceeds the request size cap of " + maxBodyBytes + " bytes"),
                    Map.of());
            return true;
        }
        int reserved = (int) (chunked ? maxBodyBytes : declared);
        if (!budget.tryAcquire(reserved)) {
            refuse(
                    request,
                    response,
                    callback,
                    startNanos,
                    reserved,
                    "budget",
                    ProblemType.SERVICE_OVERLOADED.problem(
                            "the service is reading as many request bodies as its memory budget of " + budgetBytes
                                    + " bytes allows; retry after " + RETRY_AFTER_SECONDS + " s"),
                    Map.of("Retry-After", String.valueOf(RETRY_AFTER_SECONDS)));
            return true;
        }
        new BodyRead(next, request, response, callback, chunked, reserved, null, startNanos).start();
        return true;
    }

    /**
     * Hands on a request that failed the admission test, without its body and without reserving budget: the body is
     * read and dropped first (see {@link #refuse} for why), unless the client waits for 100 Continue or the body is
     * over {@link #DRAIN_FACTOR} request caps; then nothing is read and the connection closes after the answer.
     */
    private void withhold(
            Handler next, Request request, Response response, Callback callback, long declared, long startNanos) {
        request.setAttribute(WITHHELD, Boolean.TRUE);
        boolean expectsContinue = request.getHeaders().contains(HttpHeader.EXPECT, "100-continue");
        if (expectsContinue || declared > DRAIN_FACTOR * maxBodyBytes) {
            response.getHeaders().put(HttpHeader.CONNECTION, "close");
            Request empty = new BufferedRequest(request, NO_BYTES.duplicate());
            try {
                if (!next.handle(empty, response, callback)) {
                    Response.writeError(empty, response, callback, 404);
                }
            } catch (Throwable failure) {
                Response.writeError(empty, response, callback, failure);
            }
            return;
        }
        new BodyRead(next, request, response, callback, false, 0, Refusal.WITHHELD, startNanos).start();
    }

    /**
     * Refuses a body without keeping it. A client that asked {@code Expect: 100-continue} (or whose body is over
     * {@link #DRAIN_FACTOR} request caps) is answered at once and the connection closed; any other client is sending
     * the body already, so it is read and dropped first (at the minimum rate, nothing kept): closing a connection
     * with unread bytes resets it, and the client may lose the answer.
     */
    private void refuse(
            Request request,
            Response response,
            Callback callback,
            long startNanos,
            long length,
            String reason,
            Problem problem,
            Map<String, String> headers) {
        observer.bodyRefused(reason);
        boolean expectsContinue = request.getHeaders().contains(HttpHeader.EXPECT, "100-continue");
        if (expectsContinue || length > DRAIN_FACTOR * maxBodyBytes) {
            observer.answered(
                    request.getMethod(),
                    request.getHttpURI().getPath(),
                    problem.status(),
                    System.nanoTime() - startNanos);
            problems.write(request, response, callback, problem, closing(headers));
            return;
        }
        new BodyRead(null, request, response, callback, false, 0, new Refusal(problem, headers), startNanos).start();
    }

    private static Map<String, String> closing(Map<String, String> headers) {
        Map<String, String> closing = new java.util.HashMap<>(headers);
        closing.put("Connection", "close");
        return closing;
    }

    /**
     * What a drained body gets once it has arrived: this answer, or, for {@link #WITHHELD} (no problem), the request
     * handed on without its body.
     */
    private record Refusal(Problem problem, Map<String, String> headers) {
        static final Refusal WITHHELD = new Refusal(null, Map.of());
    }

    private static String shortened(String text) {
        String printable = text == null ? "" : text.replaceAll("[^\\x20-\\x7e]", "?");
        return printable.length() > MAX_LOGGED_CHARS ? printable.substring(0, MAX_LOGGED_CHARS) + "..." : printable;
    }

    /** One body being read: Jetty calls {@link #run} whenever bytes may be available. */
    private final class BodyRead implements Runnable {
        private final Handler next;
        private final Request request;
        private final Response response;
        private final Callback callback;
        private final boolean chunked;
        /** Non-null when the body is only drained: dropped as it arrives, then this answer. */
        private final Refusal refusal;

        private final long startNanos;
        /** Set once: the body was handed on, or the request was answered here. */
        private final AtomicBoolean finished = new AtomicBoolean();

        private final AtomicBoolean released = new AtomicBoolean();
        private int reserved;
        private byte[] body;
        private volatile int length;
        private volatile Scheduler.Task rateCheck;

        BodyRead(
                Handler next,
                Request request,
                Response response,
                Callback callback,
                boolean chunked,
                int reserved,
                Refusal refusal,
                long startNanos) {
            this.refusal = refusal;
            this.startNanos = startNanos;
            this.next = next;
            this.request = request;
            this.response = response;
            this.callback = callback;
            this.chunked = chunked;
            this.reserved = reserved;
            this.body =
                    new byte[refusal != null ? 0 : chunked ? Math.min(reserved, FIRST_CHUNKED_BUFFER_BYTES) : reserved];
        }

        void start() {
            scheduleRateCheck(graceNanos);
            run();
        }

        @Override
        public void run() {
            while (!finished.get()) {
                Content.Chunk chunk = request.read();
                if (chunk == null) {
                    request.demand(this);
                    return;
                }
                if (Content.Chunk.isFailure(chunk)) {
                    unreadable(chunk.getFailure());
                    return;
                }
                boolean last = chunk.isLast();
                boolean cut = false;
                try {
                    ByteBuffer bytes = chunk.getByteBuffer();
                    int count = bytes.remaining();
                    if (refusal != null) {
                        length += count; // dropped
                        bytes.position(bytes.limit());
                        // A drain is bounded too: past DRAIN_FACTOR request caps the rest is not read.
                        cut = !last && length > DRAIN_FACTOR * maxBodyBytes;
                        continue;
                    }
                    if ((long) length + count > reserved) {
                        tooLong();
                        return;
                    }
                    if (length + count > body.length) {
                        body = Arrays.copyOf(
                                body, (int) Math.min(reserved, Math.max(2L * body.length, length + count)));
                    }
                    bytes.get(body, length, count);
                    length += count;
                } finally {
                    chunk.release();
                    if (refusal != null && (last || cut)) {
                        endDrain(cut);
                    }
                }
                if (last) {
                    handOn(false);
                    return;
                }
            }
        }

        /** Past the grace period the body must have kept the minimum average rate: bytes >= rate * (t - grace). */
        private void checkRate() {
            if (finished.get()) {
                return;
            }
            long elapsedNanos = System.nanoTime() - startNanos;
            long allowedNanos = graceNanos + length * 1_000_000_000L / minBytesPerSecond;
            if (elapsedNanos > allowedNanos) {
                answer(
                        ProblemType.REQUEST_TIMEOUT.problem("the body arrived slower than the minimum of "
                                + minBytesPerSecond + " bytes/s (" + length + " bytes in " + elapsedNanos / 1_000_000
                                + " ms); send it again faster"),
                        "slow",
                        Map.of("Connection", "close"));
            } else {
                scheduleRateCheck(allowedNanos - elapsedNanos + TimeUnit.MILLISECONDS.toNanos(1));
            }
        }

        private void scheduleRateCheck(long delayNanos) {
            rateCheck =
                    request.getComponents().getScheduler().schedule(this::checkRate, delayNanos, TimeUnit.NANOSECONDS);
        }

        private void unreadable(Throwable failure) {
            if (failure instanceof TimeoutException) {
                answer(
                        ProblemType.REQUEST_TIMEOUT.problem("no byte of the body arrived within the idle timeout"),
                        "slow",
                        Map.of("Connection", "close"));
                return;
            }
            String reason = failure instanceof HttpException
                    ? "the body framing is not valid HTTP/1.1 (" + shortened(failure.getMessage()) + ")"
                    : "the connection ended before the whole body arrived";
            answer(ProblemType.MALFORMED_HTTP.problem(reason), "unreadable", Map.of("Connection", "close"));
        }

        private void tooLong() {
            answer(
                    ProblemType.PAYLOAD_TOO_LARGE.problem(
                            "the body exceeds the request size cap of " + maxBodyBytes + " bytes"),
                    "too_large",
                    Map.of("Connection", "close"));
        }

        /** Answers here instead of handing on: one WARN line (no stack trace), the budget back, the problem. */
        private void answer(Problem problem, String refusal, Map<String, String> headers) {
            if (!finished.compareAndSet(false, true)) {
                return;
            }
            cancelRateCheck();
            release();
            observer.bodyRefused(refusal);
            observer.answered(
                    request.getMethod(),
                    request.getHttpURI().getPath(),
                    problem.status(),
                    System.nanoTime() - startNanos);
            LOG.warn(
                    "request body not accepted: {} {} answered {} after {} bytes: {}",
                    shortened(request.getMethod()),
                    shortened(request.getHttpURI().getPath()),
                    problem.status(),
                    length,
                    problem.detail());
            problems.write(request, response, callback, problem, headers);
        }

        /**
         * A drained body has been dropped (or cut, then the connection closes after the answer): the refusal, or the
         * withheld request handed on without its body.
         */
        private void endDrain(boolean cut) {
            if (refusal.problem() == null) {
                length = 0;
                handOn(cut);
                return;
            }
            if (finished.compareAndSet(false, true)) {
                cancelRateCheck();
                observer.answered(
                        request.getMethod(),
                        request.getHttpURI().getPath(),
                        refusal.problem().status(),
                        System.nanoTime() - startNanos);
                problems.write(
                        request,
                        response,
                        callback,
                        refusal.problem(),
                        cut ? closing(refusal.headers()) : refusal.headers());
            }
        }

        /**
         * The whole body is here (or, withheld, dropped): keep only its own bytes reserved and hand the request on to
         * a request thread; {@code closing} when unread bytes remain, so the connection closes after the answer.
         */
        private void handOn(boolean closing) {
            if (!finished.compareAndSet(false, true)) {
                return;
            }
            cancelRateCheck();
            if (closing) {
                response.getHeaders().put(HttpHeader.CONNECTION, "close");
            }
            if (chunked && length < reserved) {
                budget.release(reserved - length);
                reserved = length;
            }
            Request buffered = new BufferedRequest(request, ByteBuffer.wrap(body, 0, length));
            Callback releasing = new Callback() {
                @Override
                public void succeeded() {
                    release();
                    callback.succeeded();
                }

                @Override
                public void failed(Throwable failure) {
                    release();
                    callback.failed(failure);
                }

                @Override
                public InvocationType getInvocationType() {
                    return callback.getInvocationType();
                }
            };
            try {
                if (!next.handle(buffered, response, releasing)) {
                    Response.writeError(buffered, response, releasing, 404);
                }
            } catch (Throwable failure) {
                Response.writeError(buffered, response, releasing, failure);
            }
        }

        private void cancelRateCheck() {
            Scheduler.Task task = rateCheck;
            if (task != null) {
                task.cancel();
            }
        }

        private void release() {
            if (released.compareAndSet(false, true)) {
                budget.release(reserved);
            }
        }
    }

    /** The request with its body already read: the application's reads get these bytes, then the end. */
    private static final class BufferedRequest extends Request.Wrapper {
        private Content.Chunk body;

        BufferedRequest(Request request, ByteBuffer bytes) {
            super(request);
            this.body = Content.Chunk.from(bytes, true);
        }

        @Override
        public synchronized Content.Chunk read() {
            Content.Chunk chunk = body;
            body = Content.Chunk.EOF;
            return chunk;
        }

        @Override
        public void demand(Runnable demandCallback) {
            demandCallback.run();
        }
    }
}
