package com.loopwright.service.observe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import org.junit.jupiter.api.Test;

/** The two client-sent strings an access line carries: the traceparent only when well-formed, the agent cleaned. */
class AccessLogTest {

    // Cases from W3C Trace Context level 1, section 3.2 (from memory): lower-case hex, 2-32-16-2 digits, version
    // ff invalid, an all-zero trace id or parent id invalid.
    @Test
    void traceparentIsKeptOnlyWhenWellFormed() {
        String valid = "00-4bf92f3577b34da6a3ce929d0e0e4736-00f067aa0ba902b7-01";
        assertEquals(valid, AccessLog.traceparent(valid));
        assertNull(AccessLog.traceparent(valid.toUpperCase(java.util.Locale.ROOT)));
        assertNull(AccessLog.traceparent("ff-4bf92f3577b34da6a3ce929d0e0e4736-00f067aa0ba902b7-01"));
        assertNull(AccessLog.traceparent("00-00000000000000000000000000000000-00f067aa0ba902b7-01"));
        assertNull(AccessLog.traceparent("00-4bf92f3577b34da6a3ce929d0e0e4736-0000000000000000-01"));
        assertNull(AccessLog.traceparent("00-4bf92f3577b34da6a3ce929d0e0e4736-00f067aa0ba902b7"));
        assertNull(AccessLog.traceparent(valid + "\n{\"level\":\"ERROR\"}"));
        assertNull(AccessLog.traceparent(null));
    }

    @Test
    void userAgentIsCutAndControlCharactersReplaced() {
        assertEquals("curl/8.5.0", AccessLog.userAgent("curl/8.5.0"));
        assertEquals("a?b?c", AccessLog.userAgent("a\nb\u0007c"));
        assertEquals(
                AccessLog.MAX_USER_AGENT_CHARS,
                AccessLog.userAgent("x".repeat(5000)).length());
        assertNull(AccessLog.userAgent(""));
        assertNull(AccessLog.userAgent(null));
    }
}
