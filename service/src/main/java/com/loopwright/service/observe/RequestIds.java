package com.loopwright.service.observe;

import java.util.UUID;
import java.util.concurrent.ThreadLocalRandom;
import java.util.regex.Pattern;

/** X-Request-Id: a caller's id is kept when it is short and plain; otherwise a random UUID is issued. */
public final class RequestIds {

    public static final String HEADER = "X-Request-Id";
    public static final String MDC_KEY = "requestId";
    /** Accepted ids: 1 to 128 characters of letters, digits and . _ - : (safe in logs and headers). */
    private static final Pattern ACCEPTED = Pattern.compile("[A-Za-z0-9._:-]{1,128}");

    private RequestIds() {}

    public static String accept(String presented) {
        return presented != null && ACCEPTED.matcher(presented).matches() ? presented : issue();
    }

    /**
     * A random version-4 UUID (RFC 9562: 122 random bits, version and variant bits set) drawn from the thread's
     * own generator. A request id must be unique, not unguessable: UUID.randomUUID() would serialize every
     * request on the shared SecureRandom for no gain.
     */
    static String issue() {
        ThreadLocalRandom random = ThreadLocalRandom.current();
        long high = (random.nextLong() & ~0xF000L) | 0x4000L;
        long low = (random.nextLong() & 0x3FFF_FFFF_FFFF_FFFFL) | 0x8000_0000_0000_0000L;
        return new UUID(high, low).toString();
    }
}
