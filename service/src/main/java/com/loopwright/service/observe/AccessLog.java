package com.loopwright.service.observe;

import java.util.regex.Pattern;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.spi.LoggingEventBuilder;

/**
 * The access line of one request, written as SLF4J key-value pairs (JSON members with the JSON encoder, key=value
 * with the text pattern) after a short readable message "METHOD route status duration ms". The request id comes
 * from the diagnostic context. No field holds a key or a raw client string that could forge a line: the user agent
 * is cut and stripped of control characters, the trace context is kept only when it is well-formed.
 */
public final class AccessLog {

    public static final String LOGGER = "com.loopwright.access";
    /** A user agent longer than this is cut (characters). */
    public static final int MAX_USER_AGENT_CHARS = 256;
    /** W3C Trace Context, traceparent header: version-traceid-parentid-flags in lower-case hex. */
    public static final String TRACEPARENT_HEADER = "traceparent";

    private static final Pattern TRACEPARENT =
            Pattern.compile("([0-9a-f]{2})-([0-9a-f]{32})-([0-9a-f]{16})-([0-9a-f]{2})");
    private static final Logger ACCESS = LoggerFactory.getLogger(LOGGER);

    private AccessLog() {}

    /**
     * One request's access line.
     *
     * @param method     the method as a bounded label ({@link Metrics#methodLabel})
     * @param route      the route template (a bounded label)
     * @param status     the response status
     * @param seconds    time from the first handler to the end of the response [s]
     * @param bytes      response body bytes written, or -1 when unknown (left out)
     * @param apiKeyId   the presented key's short digest (see security.ApiKeys#keyId), or null (left out)
     * @param userAgent  the User-Agent header as sent, or null
     * @param traceparent the traceparent header as sent, or null
     */
    public record Line(
            String method,
            String route,
            int status,
            double seconds,
            long bytes,
            String apiKeyId,
            String userAgent,
            String traceparent) {}

    public static void write(Line line) {
        if (!ACCESS.isInfoEnabled()) {
            return;
        }
        double millis = Math.round(line.seconds() * 1e4) / 10.0;
        LoggingEventBuilder event = ACCESS.atInfo()
                .addKeyValue("method", line.method())
                .addKeyValue("route", line.route())
                .addKeyValue("status", line.status())
                .addKeyValue("durationMs", millis);
        if (line.bytes() >= 0) {
            event = event.addKeyValue("bytes", line.bytes());
        }
        if (line.apiKeyId() != null) {
            event = event.addKeyValue("apiKeyId", line.apiKeyId());
        }
        String agent = userAgent(line.userAgent());
        if (agent != null) {
            event = event.addKeyValue("userAgent", agent);
        }
        String trace = traceparent(line.traceparent());
        if (trace != null) {
            event = event.addKeyValue("traceparent", trace);
        }
        event.log(line.method() + ' ' + line.route() + ' ' + line.status() + ' ' + millis + " ms");
    }

    /** The user agent cut to {@link #MAX_USER_AGENT_CHARS}, control characters replaced by '?'; null if none. */
    static String userAgent(String sent) {
        if (sent == null || sent.isEmpty()) {
            return null;
        }
        String cut = sent.length() > MAX_USER_AGENT_CHARS ? sent.substring(0, MAX_USER_AGENT_CHARS) : sent;
        StringBuilder clean = new StringBuilder(cut.length());
        for (int i = 0; i < cut.length(); i++) {
            char c = cut.charAt(i);
            clean.append(c < 0x20 || c == 0x7f ? '?' : c);
        }
        return clean.toString();
    }

    /**
     * The traceparent when it is well-formed per W3C Trace Context level 1, section 3.2: 2-32-16-2 lower-case hex
     * digits, version not ff, trace id and parent id not all zeros; else null.
     */
    static String traceparent(String sent) {
        if (sent == null) {
            return null;
        }
        var parts = TRACEPARENT.matcher(sent.trim());
        if (!parts.matches()
                || parts.group(1).equals("ff")
                || parts.group(2).chars().allMatch(c -> c == '0')
                || parts.group(3).chars().allMatch(c -> c == '0')) {
            return null;
        }
        return parts.group();
    }
}
