package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Configuration from the environment: documented defaults, validation with the variable named, masking. */
class ServiceConfigTest {

    @Test
    void defaultsAreTheDocumentedOnes() {
        ServiceConfig config = ServiceConfig.fromEnvironment(Map.of());
        assertEquals(8080, config.port());
        assertEquals(1 << 20, config.maxRequestBytes());
        assertEquals(Runtime.getRuntime().availableProcessors(), config.workerThreads());
        assertEquals(64, config.queueCapacity());
        assertEquals(10_000, config.computeDeadlineMillis());
        assertEquals(1000, config.maxBatchItems());
        assertEquals(List.of(), config.apiKeys());
        assertEquals(List.of(), config.corsOrigins());
        assertEquals("json", config.logFormat());
        assertEquals("INFO", config.logLevel());
        assertEquals(20_000, config.shutdownGraceMillis());
        assertEquals(250, config.http().httpThreads());
        assertEquals(32L << 20, config.http().inFlightBodyBytes());
        assertEquals(16_384, config.http().minBodyBytesPerSecond());
        assertEquals(5_000, config.http().bodyGraceMillis());
        assertEquals(30_000, config.http().idleTimeoutMillis());
        // A request cap above the default budget raises the default budget with it (one body always fits).
        assertEquals(
                48L << 20,
                ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_MAX_REQUEST_BYTES", String.valueOf(48L << 20)))
                        .http()
                        .inFlightBodyBytes());
    }

    @Test
    void badValuesAreRefusedAtStartUp() {
        for (Map<String, String> bad : List.of(
                Map.of("LOOPWRIGHT_PORT", "70000"),
                Map.of("LOOPWRIGHT_WORKER_THREADS", "0"),
                Map.of("LOOPWRIGHT_QUEUE_CAPACITY", "-1"),
                Map.of("LOOPWRIGHT_COMPUTE_DEADLINE_MS", "0"),
                Map.of("LOOPWRIGHT_MAX_BATCH_ITEMS", "1001"),
                Map.of("LOOPWRIGHT_API_KEYS", "short"),
                Map.of("LOOPWRIGHT_CORS_ORIGINS", "*"),
                Map.of("LOOPWRIGHT_LOG_FORMAT", "xml"),
                Map.of("LOOPWRIGHT_LOG_LEVEL", "verbose"),
                Map.of("LOOPWRIGHT_MAX_REQUEST_BYTES", "ten"),
                Map.of("LOOPWRIGHT_API_KEYS_FILE", "/nonexistent/keys"),
                Map.of("LOOPWRIGHT_HTTP_THREADS", "4"),
                Map.of("LOOPWRIGHT_MAX_INFLIGHT_BODY_BYTES", "1024"),
                Map.of("LOOPWRIGHT_MIN_BODY_BYTES_PER_S", "0"),
                Map.of("LOOPWRIGHT_BODY_GRACE_MS", "-1"),
                Map.of("LOOPWRIGHT_IDLE_TIMEOUT_MS", "10"))) {
            assertThrows(RuntimeException.class, () -> ServiceConfig.fromEnvironment(bad), bad.toString());
        }
    }

    @Test
    void keysAreNeverShownAndTheErrorNamesOnlyThePosition() {
        String secret = "pick-and-place-secret-7";
        ServiceConfig config = ServiceConfig.fromEnvironment(Map.of(
                "LOOPWRIGHT_API_KEYS",
                secret + ", tank-level-secret-88",
                "LOOPWRIGHT_CORS_ORIGINS",
                "https://scada.plant.example:8443"));
        assertEquals(2, config.apiKeys().size());
        assertFalse(config.toString().contains(secret));
        assertTrue(config.describe().get("LOOPWRIGHT_API_KEYS").contains("2 keys"));
        assertEquals("https://scada.plant.example:8443", config.describe().get("LOOPWRIGHT_CORS_ORIGINS"));
        var failure = assertThrows(
                IllegalArgumentException.class,
                () -> ServiceConfig.fromEnvironment(Map.of("LOOPWRIGHT_API_KEYS", secret + ",weak key")));
        assertFalse(failure.getMessage().contains("weak"), failure.getMessage());
        assertTrue(failure.getMessage().contains("#2"), failure.getMessage());
    }

    /** Regression: README says every setting is printed at start-up; the keys file and the log level were not. */
    @Test
    void everyDocumentedVariableIsPrintedAtStartUp() throws Exception {
        String readme = java.nio.file.Files.readString(java.nio.file.Path.of("..", "README.md"));
        java.util.regex.Matcher row = java.util.regex.Pattern.compile("(?m)^\\| `(LOOPWRIGHT_[A-Z_]+)` \\|")
                .matcher(readme);
        java.util.Set<String> documented = new java.util.TreeSet<>();
        while (row.find()) {
            documented.add(row.group(1));
        }
        assertTrue(documented.contains("LOOPWRIGHT_LOG_LEVEL"), documented.toString());
        assertEquals(
                documented,
                new java.util.TreeSet<>(ServiceConfig.defaults(0).describe().keySet()));
    }

    @Test
    void logFormatAndLevelAreAcceptedInAnyCaseAndNormalised() {
        ServiceConfig config = ServiceConfig.fromEnvironment(
                Map.of("LOOPWRIGHT_LOG_FORMAT", " JSON ", "LOOPWRIGHT_LOG_LEVEL", "debug"));
        assertEquals("json", config.logFormat());
        assertEquals("DEBUG", config.logLevel());
    }
}
