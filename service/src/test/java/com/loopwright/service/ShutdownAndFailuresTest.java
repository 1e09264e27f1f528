package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.LoggerContext;
import ch.qos.logback.classic.joran.JoranConfigurator;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.OutputStreamAppender;
import ch.qos.logback.core.read.ListAppender;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.examples.DesignClient;
import com.loopwright.service.compute.Designs;
import com.loopwright.service.compute.ExchangeDesigns;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.slf4j.LoggerFactory;

/**
 * The end of the process: a batch stream still running when the shutdown grace period ends gets a final line that
 * says so; a failed stop and any uncaught failure are one log line; an OutOfMemoryError ends the process.
 */
class ShutdownAndFailuresTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    @Test
    void aBatchStillRunningAtTheEndOfTheGracePeriodEndsWithACutLine() throws Exception {
        // Item 0 is designed; item 1 holds its worker until the test ends, so the stop reaches its grace period.
        Designs real = new ExchangeDesigns(StrictJson.newMapper());
        CountDownLatch release = new CountDownLatch(1);
        CountDownLatch secondEntered = new CountDownLatch(1);
        AtomicInteger calls = new AtomicInteger();
        Designs secondHangs = new Designs() {
            @Override
            public Reply design(byte[] body) {
                return real.design(body);
            }

            @Override
            public Reply design(JsonNode item) {
                if (calls.incrementAndGet() >= 2) {
                    secondEntered.countDown();
                    try {
                        release.await(30, TimeUnit.SECONDS);
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                    }
                }
                return real.design(item);
            }
        };
        long graceMillis = 1_500;
        ServiceConfig config = ServiceConfig.fromEnvironment(Map.of(
                "LOOPWRIGHT_PORT",
                "0",
                "LOOPWRIGHT_WORKER_THREADS",
                "1",
                "LOOPWRIGHT_QUEUE_CAPACITY",
                "4",
                "LOOPWRIGHT_COMPUTE_DEADLINE_MS",
                "30000",
                "LOOPWRIGHT_SHUTDOWN_GRACE_MS",
                String.valueOf(graceMillis)));
        LiveServer server = LiveServer.start(config, secondHangs);
        try {
            String batch = "{\"items\":["
                    + String.join(
                            ",", DesignClient.INDEXING_AXIS, DesignClient.INDEXING_AXIS, DesignClient.INDEXING_AXIS)
                    + "]}";
            CompletableFuture<HttpResponse<String>> reply = server.http()
                    .sendAsync(
                            HttpRequest.newBuilder(server.base().resolve("/v1/designs/batch"))
                                    .timeout(Duration.ofSeconds(20))
                                    .header("Content-Type", "application/json")
                                    .POST(HttpRequest.BodyPublishers.ofString(batch))
                                    .build(),
                            HttpResponse.BodyHandlers.ofString());
            assertTrue(secondEntered.await(10, TimeUnit.SECONDS), "the second item started");
            long stopStarted = System.nanoTime();
            CompletableFuture<Void> stop =
                    CompletableFuture.runAsync(() -> server.app().stop());
            // The body must end well-formed (a broken chunked body is an IOException here).
            HttpResponse<String> response = reply.get(10, TimeUnit.SECONDS);
            long endedMillis = (System.nanoTime() - stopStarted) / 1_000_000;
            assertEquals(200, response.statusCode());
            assertTrue(endedMillis < graceMillis, "the stream ended within the grace period: " + endedMillis + " ms");
            String[] lines = response.body().split("\n");
            assertEquals(2, lines.length, response.body());
            assertTrue(response.body().endsWith("\n"));
            Contract contract = server.contract();
            for (String line : lines) {
                String violations = contract.violations(
                        "/v1/designs/batch", "post", 200, "application/x-ndjson", JSON.readTree(line));
                assertTrue(violations.isEmpty(), violations + " in " + line);
            }
            assertEquals(200, JSON.readTree(lines[0]).get("status").asInt());
            JsonNode cut = JSON.readTree(lines[1]);
            assertEquals(1, cut.get("resumeFromIndex").asInt(), lines[1]);
            assertEquals(503, cut.get("status").asInt());
            assertEquals(ProblemType.NOT_READY.uri(), cut.at("/problem/type").asText());
            stop.get(10, TimeUnit.SECONDS);
        } finally {
            release.countDown();
        }
    }

    @Test
    void aStopThatFailsIsOneLogLineAndNothingEscapesTheHook() throws Exception {
        Logger main = (Logger) LoggerFactory.getLogger(LoopwrightMain.class);
        ListAppender<ILoggingEvent> captured = new ListAppender<>();
        captured.start();
        main.addAppender(captured);
        try {
            LoopwrightMain.shutdownHook(() -> {
                        throw new IllegalStateException("stop failed", new TimeoutException("graceful stop timed out"));
                    })
                    .run();
        } finally {
            main.detachAppender(captured);
        }
        List<ILoggingEvent> errors =
                captured.list.stream().filter(e -> e.getLevel() == Level.ERROR).toList();
        assertEquals(1, errors.size(), captured.list.toString());
        assertOneJsonLine(errors.get(0));
    }

    @Test
    void anUncaughtFailureIsOneLogLineAndAnOutOfMemoryErrorEndsTheProcess() throws Exception {
        List<Integer> halts = new CopyOnWriteArrayList<>();
        FatalErrors fatal = new FatalErrors(halts::add);
        Logger logger = (Logger) LoggerFactory.getLogger(FatalErrors.class);
        ListAppender<ILoggingEvent> captured = new ListAppender<>();
        captured.start();
        logger.addAppender(captured);
        try {
            fatal.uncaughtException(Thread.currentThread(), new IllegalStateException("a worker failed"));
            assertEquals(List.of(), halts, "an ordinary failure does not end the process");
            fatal.uncaughtException(
                    Thread.currentThread(), new RuntimeException(new OutOfMemoryError("Java heap space")));
            assertEquals(List.of(FatalErrors.OUT_OF_MEMORY_EXIT_STATUS), halts);
        } finally {
            logger.detachAppender(captured);
        }
        assertEquals(2, captured.list.size());
        captured.list.forEach(ShutdownAndFailuresTest::assertOneJsonLine);
        assertTrue(captured.list.get(1).getFormattedMessage().contains("out of memory"));
    }

    @Test
    void anOutOfMemoryErrorInADesignEndsTheProcess() throws Exception {
        List<Integer> halts = new CopyOnWriteArrayList<>();
        Designs exhausted = new Designs() {
            @Override
            public Reply design(byte[] body) {
                throw new OutOfMemoryError("Java heap space");
            }

            @Override
            public Reply design(JsonNode item) {
                throw new OutOfMemoryError("Java heap space");
            }
        };
        try (LiveServer server = LiveServer.start(ServiceConfig.defaults(0), exhausted, new FatalErrors(halts::add))) {
            // The process would be gone by now; the test's halt only records it, so the request still gets an answer.
            HttpResponse<String> reply = server.http()
                    .send(
                            HttpRequest.newBuilder(server.base().resolve("/v1/designs"))
                                    .timeout(Duration.ofSeconds(10))
                                    .header("Content-Type", "application/json")
                                    .POST(HttpRequest.BodyPublishers.ofString(DesignClient.INDEXING_AXIS))
                                    .build(),
                            HttpResponse.BodyHandlers.ofString());
            assertTrue(reply.statusCode() >= 500, "status " + reply.statusCode());
        }
        assertEquals(List.of(FatalErrors.OUT_OF_MEMORY_EXIT_STATUS), halts);
    }

    /** The event as the shipped logback.xml writes it in the default JSON format: exactly one line of JSON. */
    private static void assertOneJsonLine(ILoggingEvent event) {
        LoggerContext context = new LoggerContext();
        try {
            JoranConfigurator configurator = new JoranConfigurator();
            configurator.setContext(context);
            configurator.doConfigure(
                    Path.of("src", "main", "resources", "logback.xml").toFile());
            Logger root = context.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME);
            @SuppressWarnings("unchecked")
            var appender = (OutputStreamAppender<ILoggingEvent>) root.getAppender("json");
            String line = new String(appender.getEncoder().encode(event), StandardCharsets.UTF_8);
            assertTrue(line.endsWith("\n") && line.indexOf('\n') == line.length() - 1, "one line: " + line);
            JsonNode json = JSON.readTree(line);
            assertNotNull(json.get("level"));
            assertFalse(json.get("message").asText().isEmpty());
            if (event.getThrowableProxy() != null) {
                assertTrue(
                        json.get("exception")
                                .asText()
                                .contains(event.getThrowableProxy().getClassName()),
                        line);
            }
        } catch (Exception e) {
            throw new AssertionError(e);
        } finally {
            context.stop();
        }
    }
}
