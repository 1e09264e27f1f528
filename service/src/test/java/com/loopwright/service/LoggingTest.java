package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.LoggerContext;
import ch.qos.logback.classic.joran.JoranConfigurator;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.classic.spi.LoggingEvent;
import ch.qos.logback.core.OutputStreamAppender;
import ch.qos.logback.core.read.ListAppender;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.examples.DesignClient;
import java.net.http.HttpRequest;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slf4j.LoggerFactory;

/** The shipped logback.xml writes one JSON object per line with the request id; access lines carry it. */
class LoggingTest {

    @Test
    void shippedConfigurationWritesJsonLinesWithTheRequestId() throws Exception {
        LoggerContext context = new LoggerContext();
        JoranConfigurator configurator = new JoranConfigurator();
        configurator.setContext(context);
        configurator.doConfigure(
                Path.of("src", "main", "resources", "logback.xml").toFile());
        Logger root = context.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME);
        var appender = (OutputStreamAppender<ILoggingEvent>) root.getAppender("json");
        LoggingEvent event = new LoggingEvent(
                LoggerContext.class.getName(),
                context.getLogger("com.loopwright.access"),
                Level.INFO,
                "POST {} 200",
                null,
                new Object[] {"/v1/designs"});
        event.setMDCPropertyMap(Map.of("requestId", "conveyor-7"));
        String line = new String(appender.getEncoder().encode(event), StandardCharsets.UTF_8);
        assertTrue(line.endsWith("\n") && line.indexOf('\n') == line.length() - 1, "one line: " + line);
        JsonNode json = new ObjectMapper().readTree(line);
        assertEquals("conveyor-7", json.get("requestId").asText(), line);
        assertEquals("INFO", json.get("level").asText());
        assertEquals("POST /v1/designs 200", json.get("message").asText());
        // RFC 3339 (section 5.6) date-time in UTC, read back by java.time's ISO-8601 instant parser.
        String timestamp = json.get("timestamp").asText();
        assertTrue(timestamp.matches("\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}\\.\\d{3}Z"), timestamp);
        assertEquals(event.getTimeStamp(), java.time.Instant.parse(timestamp).toEpochMilli());
        context.stop();
    }

    @Test
    void accessLinesCarryTheRequestIdAndNoKey() throws Exception {
        Logger access = (Logger) LoggerFactory.getLogger("com.loopwright.access");
        ListAppender<ILoggingEvent> captured = new ListAppender<>();
        captured.start();
        Level before = access.getLevel();
        access.setLevel(Level.INFO);
        access.addAppender(captured);
        String key = "camera-gimbal-key-000123";
        String traceparent = "00-4bf92f3577b34da6a3ce929d0e0e4736-00f067aa0ba902b7-01"; // W3C Trace Context example
        LiveServer.Reply reply;
        try (LiveServer server = LiveServer.start(ServiceConfig.defaults(0).withApiKeys(java.util.List.of(key)))) {
            reply = server.send(
                    HttpRequest.newBuilder(server.base().resolve("/v1/designs"))
                            .timeout(Duration.ofSeconds(30))
                            .header("Content-Type", "application/json")
                            .header("X-Request-Id", "pick-and-place-99")
                            .header("X-Api-Key", key)
                            .header("User-Agent", "line-3-controller/2.1")
                            .header("traceparent", traceparent)
                            .POST(HttpRequest.BodyPublishers.ofString(DesignClient.INDEXING_AXIS))
                            .build(),
                    "/v1/designs",
                    "post");
            assertEquals(200, reply.status());
            for (int i = 0; i < 100 && captured.list.isEmpty(); i++) {
                Thread.sleep(10);
            }
        } finally {
            access.detachAppender(captured);
            access.setLevel(before);
        }
        assertEquals(1, captured.list.size());
        ILoggingEvent event = captured.list.get(0);
        assertEquals("pick-and-place-99", event.getMDCPropertyMap().get("requestId"));
        assertTrue(event.getFormattedMessage().startsWith("POST /v1/designs 200"), event.getFormattedMessage());
        // The line as the shipped JSON encoder writes it, parsed back into its fields.
        String line =
                new String(new com.loopwright.service.observe.JsonLineEncoder().encode(event), StandardCharsets.UTF_8);
        assertFalse(line.contains(key), line);
        JsonNode json = new ObjectMapper().readTree(line);
        assertEquals("POST", json.get("method").asText(), line);
        assertEquals("/v1/designs", json.get("route").asText());
        assertEquals(200, json.get("status").asInt());
        assertTrue(json.get("status").isInt() && json.get("durationMs").isNumber(), line);
        assertTrue(json.get("durationMs").asDouble() > 0, line);
        assertEquals(
                reply.text().getBytes(StandardCharsets.UTF_8).length,
                json.get("bytes").asLong(),
                line);
        assertEquals("pick-and-place-99", json.get("requestId").asText());
        // The key's id: the first 8 hex digits of its SHA-256 digest (FIPS 180-4, as the JDK computes it).
        byte[] digest = java.security.MessageDigest.getInstance("SHA-256").digest(key.getBytes(StandardCharsets.UTF_8));
        assertEquals(
                java.util.HexFormat.of().formatHex(digest, 0, 4),
                json.get("apiKeyId").asText());
        assertEquals("line-3-controller/2.1", json.get("userAgent").asText());
        assertEquals(traceparent, json.get("traceparent").asText());
        assertTrue(json.get("timestamp").asText().endsWith("Z"));
        assertEquals(json.get("message").asText(), event.getFormattedMessage());
    }

    @Test
    void textFormatKeepsTheReadableMessageAndAppendsTheFields() {
        LoggerContext context = new LoggerContext();
        com.loopwright.service.observe.LogSettings.apply(context, "text", "INFO");
        var appender = (OutputStreamAppender<ILoggingEvent>)
                context.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME).getAppender("text");
        LoggingEvent event = new LoggingEvent(
                LoggerContext.class.getName(),
                context.getLogger("com.loopwright.access"),
                Level.INFO,
                "POST /v1/designs 200 12.5 ms",
                null,
                null);
        event.setMDCPropertyMap(Map.of("requestId", "conveyor-7"));
        event.addKeyValuePair(new org.slf4j.event.KeyValuePair("route", "/v1/designs"));
        event.addKeyValuePair(new org.slf4j.event.KeyValuePair("status", 200));
        String line = new String(appender.getEncoder().encode(event), StandardCharsets.UTF_8);
        assertTrue(line.contains("[conveyor-7]") && line.contains("- POST /v1/designs 200 12.5 ms "), line);
        assertTrue(line.contains("route=\"/v1/designs\"") && line.contains("status=\"200\""), line);
        context.stop();
    }

    @Test
    void accessLinesLeaveOutAKeyIdWhenKeysAreOffAndAMalformedTraceparent() throws Exception {
        Logger access = (Logger) LoggerFactory.getLogger("com.loopwright.access");
        ListAppender<ILoggingEvent> captured = new ListAppender<>();
        captured.start();
        Level before = access.getLevel();
        access.setLevel(Level.INFO);
        access.addAppender(captured);
        try (LiveServer server = LiveServer.start()) {
            var reply = server.send(
                    HttpRequest.newBuilder(server.base().resolve("/health"))
                            .timeout(Duration.ofSeconds(30))
                            .header("X-Api-Key", "camera-gimbal-key-000123")
                            // Upper-case hex: not a valid traceparent (W3C Trace Context, section 3.2.2.1).
                            .header("traceparent", "00-4BF92F3577B34DA6A3CE929D0E0E4736-00F067AA0BA902B7-01")
                            .GET()
                            .build(),
                    "/health",
                    "get");
            assertEquals(200, reply.status());
            for (int i = 0; i < 100 && captured.list.isEmpty(); i++) {
                Thread.sleep(10);
            }
        } finally {
            access.detachAppender(captured);
            access.setLevel(before);
        }
        JsonNode json = new ObjectMapper()
                .readTree(new com.loopwright.service.observe.JsonLineEncoder().encode(captured.list.get(0)));
        assertEquals("/health", json.get("route").asText(), json.toString());
        assertFalse(json.has("apiKeyId"), json.toString());
        assertFalse(json.has("traceparent"), json.toString());
    }

    /**
     * Regression: LOOPWRIGHT_LOG_FORMAT=JSON passed validation (lower-cased) while logback looked up the raw value
     * and attached no appender, so the service logged nothing. Every accepted spelling must attach an appender
     * that writes.
     */
    @Test
    void everyAcceptedFormatAndLevelSpellingLogs() {
        for (String[] spelling : new String[][] {{"JSON", "info"}, {"Text", "WARN"}, {"json", "Debug"}}) {
            ServiceConfig config = ServiceConfig.fromEnvironment(
                    Map.of("LOOPWRIGHT_LOG_FORMAT", spelling[0], "LOOPWRIGHT_LOG_LEVEL", spelling[1]));
            LoggerContext context = new LoggerContext();
            com.loopwright.service.observe.LogSettings.apply(context, config.logFormat(), config.logLevel());
            Logger root = context.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME);
            var appender = root.getAppender(config.logFormat());
            assertTrue(appender != null && appender.isStarted(), "an appender for " + spelling[0]);
            assertEquals(Level.toLevel(config.logLevel()), root.getLevel(), spelling[1]);
            assertTrue(root.isEnabledFor(Level.WARN), "warnings are written");
            context.stop();
        }
    }
}
