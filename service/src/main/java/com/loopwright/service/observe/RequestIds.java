package com.loopwright.service.observe;

import java.util.UUID;
import java.util.regex.Pattern;

/** X-Request-Id: a caller's id is kept when it is short and plain; otherwise a random UUID is issued. */
public final class RequestIds {

    public static final String HEADER = "X-Request-Id";
    public static final String MDC_KEY = "requestId";
    /** Accepted ids: 1 to 128 characters of letters, digits and . _ - : (safe in logs and headers). */
    private static final Pattern ACCEPTED = Pattern.compile("[A-Za-z0-9._:-]{1,128}");

    private RequestIds() {
    }

    public static String accept(String presented) {
        return presented != null && ACCEPTED.matcher(presented).matches() ? presented : UUID.randomUUID().toString();
    }
}
