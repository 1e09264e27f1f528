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

    /** Where an occurrence's problem points (RFC 9457 section 3.1.5); see {@link #instance(String)}. */
    public static final String INSTANCE_PREFIX = "/requests/";

    private RequestIds() {}

    /**
     * The problem {@code instance} of the request with this id: {@code /requests/<id>}, a relative reference
     * (accepted ids hold only URI path characters, so it needs no escaping).
     */
    public static String instance(String requestId) {
        return INSTANCE_PREFIX + requestId;
    }

    /** The {@code instance} of item {@code index} of a batch: the request's, with the item's JSON pointer as fragment. */
    public static String itemInstance(String requestId, int index) {
        return instance(requestId) + "#/items/" + index;
    }

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
