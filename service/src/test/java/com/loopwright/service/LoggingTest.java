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
        assertEquals("conveyor-7", json.at("/mdc/requestId").asText(), line);
        assertEquals("INFO", json.get("level").asText());
        assertEquals("POST /v1/designs 200", json.get("formattedMessage").asText());
        context.stop();
    }

    @Test
    void accessLinesCarryTheRequestIdAndNoKey() {
        Logger access = (Logger) LoggerFactory.getLogger("com.loopwright.access");
        ListAppender<ILoggingEvent> captured = new ListAppender<>();
        captured.start();
        Level before = access.getLevel();
        access.setLevel(Level.INFO);
        access.addAppender(captured);
        String key = "camera-gimbal-key-000123";
        try (LiveServer server = LiveServer.start(ServiceConfig.defaults(0).withApiKeys(java.util.List.of(key)))) {
            var reply = server.send(
                    HttpRequest.newBuilder(server.base().resolve("/v1/designs"))
                            .timeout(Duration.ofSeconds(30))
                            .header("Content-Type", "application/json")
                            .header("X-Request-Id", "pick-and-place-99")
                            .header("X-Api-Key", key)
                            .POST(HttpRequest.BodyPublishers.ofString(DesignClient.INDEXING_AXIS))
                            .build(),
                    "/v1/designs",
                    "post");
            assertEquals(200, reply.status());
            for (int i = 0; i < 100 && captured.list.isEmpty(); i++) {
                Thread.sleep(10);
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } finally {
            access.detachAppender(captured);
            access.setLevel(before);
        }
        assertEquals(1, captured.list.size());
        ILoggingEvent line = captured.list.get(0);
        assertEquals("pick-and-place-99", line.getMDCPropertyMap().get("requestId"));
        assertTrue(line.getFormattedMessage().startsWith("POST /v1/designs 200"), line.getFormattedMessage());
        assertFalse(line.getFormattedMessage().contains(key));
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
