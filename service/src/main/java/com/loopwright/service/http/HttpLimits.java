package com.loopwright.service.http;

/**
 * Limits of the HTTP layer that keep one client from exhausting the request threads or the heap
 * (docs/limits-and-budgets.md, "HTTP layer").
 *
 * @param httpThreads             Jetty request threads (LOOPWRIGHT_HTTP_THREADS, default {@value #DEFAULT_HTTP_THREADS})
 * @param inFlightBodyBytes       bytes of request bodies being read, parsed and served at once: each body reserves
 *                                its Content-Length (a chunked body the request cap) before a byte is read; when the
 *                                budget is spent a request gets 503 with Retry-After (LOOPWRIGHT_MAX_INFLIGHT_BODY_BYTES,
 *                                default 32 MiB)
 * @param minBodyBytesPerSecond   after the grace period a body must have arrived at this average rate since its
 *                                headers, else 408 (LOOPWRIGHT_MIN_BODY_BYTES_PER_S, default 16384)
 * @param bodyGraceMillis         time a body may take before the rate is enforced (LOOPWRIGHT_BODY_GRACE_MS,
 *                                default 5000)
 * @param idleTimeoutMillis       a connection with no bytes in either direction for this long is closed
 *                                (LOOPWRIGHT_IDLE_TIMEOUT_MS, default 30000)
 */
public record HttpLimits(
        int httpThreads,
        long inFlightBodyBytes,
        long minBodyBytesPerSecond,
        long bodyGraceMillis,
        long idleTimeoutMillis) {

    /** Javalin's own default for the Jetty pool. */
    public static final int DEFAULT_HTTP_THREADS = 250;

    public static final long DEFAULT_INFLIGHT_BODY_BYTES = 32L << 20;
    public static final long DEFAULT_MIN_BODY_BYTES_PER_SECOND = 16_384;
    public static final long DEFAULT_BODY_GRACE_MILLIS = 5_000;
    public static final long DEFAULT_IDLE_TIMEOUT_MILLIS = 30_000;
    /** Request line and headers together (Jetty's default); larger ones get 431. */
    public static final int MAX_HEADER_BYTES = 8 * 1024;
    /** Jetty needs a few threads of its own (acceptor, selector, reserved); fewer cannot serve. */
    public static final int MIN_HTTP_THREADS = 8;

    public static final int MAX_HTTP_THREADS = 2_000;
    /** Budget permits are an int count of bytes. */
    public static final long MAX_INFLIGHT_BODY_BYTES = 1L << 30;

    public HttpLimits {
        if (httpThreads < MIN_HTTP_THREADS || httpThreads > MAX_HTTP_THREADS) {
            throw new IllegalArgumentException(
                    "HTTP threads must be from " + MIN_HTTP_THREADS + " to " + MAX_HTTP_THREADS + ": " + httpThreads);
        }
        if (inFlightBodyBytes < 1024 || inFlightBodyBytes > MAX_INFLIGHT_BODY_BYTES) {
            throw new IllegalArgumentException(
                    "in-flight body bytes must be from 1 KiB to 1 GiB: " + inFlightBodyBytes);
        }
        if (minBodyBytesPerSecond < 1 || minBodyBytesPerSecond > (1L << 30)) {
            throw new IllegalArgumentException(
                    "minimum body rate must be from 1 to 2^30 bytes/s: " + minBodyBytesPerSecond);
        }
        if (bodyGraceMillis < 0 || bodyGraceMillis > 600_000) {
            throw new IllegalArgumentException("body grace must be from 0 to 600000 ms: " + bodyGraceMillis);
        }
        if (idleTimeoutMillis < 100 || idleTimeoutMillis > 600_000) {
            throw new IllegalArgumentException("idle timeout must be from 100 to 600000 ms: " + idleTimeoutMillis);
        }
    }

    public static HttpLimits defaults() {
        return new HttpLimits(
                DEFAULT_HTTP_THREADS,
                DEFAULT_INFLIGHT_BODY_BYTES,
                DEFAULT_MIN_BODY_BYTES_PER_SECOND,
                DEFAULT_BODY_GRACE_MILLIS,
                DEFAULT_IDLE_TIMEOUT_MILLIS);
    }
}
