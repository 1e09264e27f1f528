package com.loopwright.service.observe;

import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.classic.spi.IThrowableProxy;
import ch.qos.logback.classic.spi.ThrowableProxyUtil;
import ch.qos.logback.core.encoder.EncoderBase;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.slf4j.event.KeyValuePair;

/**
 * One JSON object per log line, flat: {@code timestamp} (RFC 3339, UTC, milliseconds), {@code level},
 * {@code logger}, {@code thread}, {@code message} (the formatted message), the diagnostic context (the request's
 * {@code requestId}), then the event's SLF4J key-value pairs as top-level members (numbers and booleans as JSON
 * numbers and booleans), and {@code exception} with the stack trace when there is one.
 *
 * <p>Written here rather than with logback's JsonEncoder: that encoder writes the time as epoch milliseconds, has
 * no {@code message} member for the formatted text, and nests the key-value pairs as a list of one-member
 * objects, which log processors cannot index as fields. Jackson writes the JSON (escaping included).
 */
public final class JsonLineEncoder extends EncoderBase<ILoggingEvent> {

    /** RFC 3339 date-time in UTC with milliseconds, e.g. 2026-12-04T00:27:06.120Z. */
    static final DateTimeFormatter RFC_3339 =
            DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSSXXX").withZone(ZoneOffset.UTC);
    /** Members written before the key-value pairs; a pair with one of these keys is left out. */
    static final Set<String> RESERVED = Set.of("timestamp", "level", "logger", "thread", "message", "exception");
    /** Caps per line: diagnostic-context entries and key-value pairs. */
    static final int MAX_CONTEXT_ENTRIES = 16;

    static final int MAX_KEY_VALUES = 32;
    /** A stack trace longer than this is cut (characters). */
    static final int MAX_EXCEPTION_CHARS = 16_384;

    private static final byte[] NONE = new byte[0];
    private final JsonFactory json = new JsonFactory();

    @Override
    public byte[] headerBytes() {
        return NONE;
    }

    @Override
    public byte[] footerBytes() {
        return NONE;
    }

    @Override
    public byte[] encode(ILoggingEvent event) {
        ByteArrayOutputStream out = new ByteArrayOutputStream(256);
        try (JsonGenerator line = json.createGenerator(out)) {
            line.writeStartObject();
            line.writeStringField("timestamp", RFC_3339.format(Instant.ofEpochMilli(event.getTimeStamp())));
            line.writeStringField("level", event.getLevel().toString());
            line.writeStringField("logger", event.getLoggerName());
            line.writeStringField("thread", event.getThreadName());
            line.writeStringField("message", event.getFormattedMessage());
            Set<String> written = new HashSet<>(RESERVED);
            Map<String, String> context = event.getMDCPropertyMap();
            if (context != null) {
                int entries = 0;
                for (Map.Entry<String, String> entry : context.entrySet()) {
                    if (entries++ >= MAX_CONTEXT_ENTRIES) {
                        break;
                    }
                    if (written.add(entry.getKey())) {
                        line.writeStringField(entry.getKey(), entry.getValue());
                    }
                }
            }
            List<KeyValuePair> pairs = event.getKeyValuePairs();
            if (pairs != null) {
                int count = 0;
                for (KeyValuePair pair : pairs) {
                    if (count++ >= MAX_KEY_VALUES) {
                        break;
                    }
                    if (pair.key != null && pair.value != null && written.add(pair.key)) {
                        line.writeFieldName(pair.key);
                        writeValue(line, pair.value);
                    }
                }
            }
            IThrowableProxy thrown = event.getThrowableProxy();
            if (thrown != null) {
                String trace = ThrowableProxyUtil.asString(thrown);
                line.writeStringField(
                        "exception",
                        trace.length() > MAX_EXCEPTION_CHARS ? trace.substring(0, MAX_EXCEPTION_CHARS) : trace);
            }
            line.writeEndObject();
        } catch (IOException e) {
            throw new UncheckedIOException("a byte array stream does not fail", e);
        }
        out.write('\n');
        return out.toByteArray();
    }

    private static void writeValue(JsonGenerator line, Object value) throws IOException {
        if (value instanceof Integer || value instanceof Long || value instanceof Short) {
            line.writeNumber(((Number) value).longValue());
        } else if (value instanceof Double number && Double.isFinite(number)) {
            line.writeNumber(number);
        } else if (value instanceof Float number && Float.isFinite(number)) {
            line.writeNumber(number);
        } else if (value instanceof Boolean flag) {
            line.writeBoolean(flag);
        } else {
            line.writeString(String.valueOf(value));
        }
    }
}
