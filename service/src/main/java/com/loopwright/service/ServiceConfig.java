package com.loopwright.service;

import com.loopwright.api.endpoint.ServiceVersion;
import com.loopwright.service.http.HttpLimits;
import com.loopwright.service.security.ApiKeys;
import com.loopwright.service.security.ApiKeysFile;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Settings read once at start-up from the environment (README "Configuration" lists every variable).
 *
 * @param port                TCP port (LOOPWRIGHT_PORT, default 8080; 0 picks a free port)
 * @param maxRequestBytes     request body cap in bytes (LOOPWRIGHT_MAX_REQUEST_BYTES, default 1 MiB)
 * @param workerThreads       design computations run on this many pool threads (LOOPWRIGHT_WORKER_THREADS,
 *                            default the number of processors)
 * @param queueCapacity       designs waiting for a worker before new ones get 503 (LOOPWRIGHT_QUEUE_CAPACITY,
 *                            default 64)
 * @param computeDeadlineMillis one request's compute deadline (a batch: all its items); past it 504 and the
 *                            computation is cancelled
 *                            (LOOPWRIGHT_COMPUTE_DEADLINE_MS, default 10000)
 * @param maxBatchItems       items per POST /v1/designs/batch (LOOPWRIGHT_MAX_BATCH_ITEMS, default 1000, at most
 *                            {@link #BATCH_ITEMS_CEILING})
 * @param apiKeys             accepted API keys at start-up; empty turns authentication off (LOOPWRIGHT_API_KEYS, comma
 *                            separated, and/or LOOPWRIGHT_API_KEYS_FILE, one key per line)
 * @param fixedApiKeys        the keys of LOOPWRIGHT_API_KEYS alone (they stay when the key file is re-read)
 * @param corsOrigins         browser origins allowed by CORS; empty turns CORS off (LOOPWRIGHT_CORS_ORIGINS)
 * @param apiKeysFile         the file the keys were also read from (LOOPWRIGHT_API_KEYS_FILE), or null
 * @param logFormat           "json" or "text", any case (LOOPWRIGHT_LOG_FORMAT, default json); applied to logback
 *                            by {@link com.loopwright.service.observe.LogSettings}
 * @param logLevel            root log level TRACE, DEBUG, INFO, WARN, ERROR or OFF, any case (LOOPWRIGHT_LOG_LEVEL,
 *                            default INFO)
 * @param shutdownGraceMillis how long a stop waits for in-flight requests (LOOPWRIGHT_SHUTDOWN_GRACE_MS,
 *                            default 20000)
 * @param metricsPort         a separate management port serving only GET /metrics (LOOPWRIGHT_METRICS_PORT), or -1
 *                            (unset, the default) for /metrics on the main port; 0 picks a free port
 * @param http                limits of the HTTP layer: request threads, in-flight body bytes, minimum body rate,
 *                            idle timeout ({@link HttpLimits})
 * @param serviceVersion      the version every response states: the project version the build stamped
 *                            ({@link ServiceVersion#fromBuild}), not an environment variable; tests that record
 *                            answers fix it with {@link #withServiceVersion}
 */
public record ServiceConfig(
        int port,
        long maxRequestBytes,
        int workerThreads,
        int queueCapacity,
        long computeDeadlineMillis,
        int maxBatchItems,
        List<String> apiKeys,
        List<String> fixedApiKeys,
        List<String> corsOrigins,
        String apiKeysFile,
        String logFormat,
        String logLevel,
        long shutdownGraceMillis,
        int metricsPort,
        HttpLimits http,
        String serviceVersion) {

    public static final int DEFAULT_PORT = 8080;
    public static final long DEFAULT_MAX_REQUEST_BYTES = 1L << 20;
    public static final int DEFAULT_QUEUE_CAPACITY = 64;
    public static final long DEFAULT_COMPUTE_DEADLINE_MILLIS = 10_000;
    public static final int DEFAULT_MAX_BATCH_ITEMS = 1000;
    /** The documented batch cap (openapi.yaml maxItems); the environment may only lower it. */
    public static final int BATCH_ITEMS_CEILING = 1000;

    public static final String DEFAULT_LOG_FORMAT = "json";
    public static final String DEFAULT_LOG_LEVEL = "INFO";
    /** The root levels logback knows; anything else would silently become DEBUG there. */
    public static final List<String> LOG_LEVELS = List.of("TRACE", "DEBUG", "INFO", "WARN", "ERROR", "OFF");

    public static final long DEFAULT_SHUTDOWN_GRACE_MILLIS = 20_000;
    /** Caps on the configuration itself, so that a typo cannot exhaust the machine. */
    public static final int MAX_WORKER_THREADS = 256;

    public static final int MAX_QUEUE_CAPACITY = 100_000;
    public static final int MAX_API_KEYS = ApiKeys.MAX_KEYS;
    public static final int MAX_CORS_ORIGINS = 64;
    public static final int MIN_API_KEY_LENGTH = ApiKeys.MIN_KEY_LENGTH;
    /** LOOPWRIGHT_METRICS_PORT unset: /metrics is served on the main port. */
    public static final int METRICS_ON_MAIN_PORT = -1;

    public ServiceConfig {
        if (port < 0 || port > 65_535) {
            throw new IllegalArgumentException("port must be from 0 to 65535: " + port);
        }
        if (maxRequestBytes < 1024 || maxRequestBytes > (64L << 20)) {
            throw new IllegalArgumentException("request cap must be from 1 KiB to 64 MiB: " + maxRequestBytes);
        }
        if (workerThreads < 1 || workerThreads > MAX_WORKER_THREADS) {
            throw new IllegalArgumentException(
                    "worker threads must be from 1 to " + MAX_WORKER_THREADS + ": " + workerThreads);
        }
        if (queueCapacity < 0 || queueCapacity > MAX_QUEUE_CAPACITY) {
            throw new IllegalArgumentException(
                    "queue capacity must be from 0 to " + MAX_QUEUE_CAPACITY + ": " + queueCapacity);
        }
        if (computeDeadlineMillis < 1 || computeDeadlineMillis > 600_000) {
            throw new IllegalArgumentException(
                    "compute deadline must be from 1 to 600000 ms: " + computeDeadlineMillis);
        }
        if (maxBatchItems < 1 || maxBatchItems > BATCH_ITEMS_CEILING) {
            throw new IllegalArgumentException(
                    "batch cap must be from 1 to " + BATCH_ITEMS_CEILING + ": " + maxBatchItems);
        }
        apiKeys = List.copyOf(apiKeys);
        fixedApiKeys = List.copyOf(fixedApiKeys);
        // The key itself is never echoed, only its position.
        ApiKeys.validate(apiKeys);
        if (!apiKeys.containsAll(fixedApiKeys)) {
            throw new IllegalArgumentException("the fixed API keys are among the accepted keys");
        }
        if (metricsPort < METRICS_ON_MAIN_PORT || metricsPort > 65_535) {
            throw new IllegalArgumentException("metrics port must be from 0 to 65535 (or unset): " + metricsPort);
        }
        if (metricsPort > 0 && metricsPort == port) {
            throw new IllegalArgumentException("the metrics port must differ from the main port: " + metricsPort);
        }
        corsOrigins = List.copyOf(corsOrigins);
        if (corsOrigins.size() > MAX_CORS_ORIGINS) {
            throw new IllegalArgumentException("at most " + MAX_CORS_ORIGINS + " CORS origins");
        }
        for (String origin : corsOrigins) {
            if (!origin.matches("https?://[A-Za-z0-9.-]+(:[0-9]{1,5})?")) {
                throw new IllegalArgumentException("CORS origin must be scheme://host[:port]: " + origin);
            }
        }
        if (!logFormat.equals("json") && !logFormat.equals("text")) {
            throw new IllegalArgumentException("log format must be json or text: " + logFormat);
        }
        if (!LOG_LEVELS.contains(logLevel)) {
            throw new IllegalArgumentException("log level must be one of " + LOG_LEVELS + ": " + logLevel);
        }
        if (shutdownGraceMillis < 0 || shutdownGraceMillis > 600_000) {
            throw new IllegalArgumentException("shutdown grace must be from 0 to 600000 ms: " + shutdownGraceMillis);
        }
        if (serviceVersion == null || serviceVersion.isBlank()) {
            throw new IllegalArgumentException("the service version must be stated");
        }
        if (http.inFlightBodyBytes() < maxRequestBytes) {
            throw new IllegalArgumentException("in-flight body bytes (" + http.inFlightBodyBytes()
                    + ") must hold at least one body of the request cap (" + maxRequestBytes + ")");
        }
    }

    /** Defaults for everything, on the given port. */
    public static ServiceConfig defaults(int port) {
        return fromEnvironment(Map.of("LOOPWRIGHT_PORT", String.valueOf(port)));
    }

    public static ServiceConfig fromEnvironment(Map<String, String> environment) {
        List<String> fixedKeys = list(environment.get("LOOPWRIGHT_API_KEYS"));
        List<String> keys = new ArrayList<>(fixedKeys);
        String keyFile = environment.get("LOOPWRIGHT_API_KEYS_FILE");
        if (keyFile != null && !keyFile.isBlank()) {
            keys.addAll(readKeyFile(Path.of(keyFile.trim())));
        }
        long maxRequestBytes = parse(environment, "LOOPWRIGHT_MAX_REQUEST_BYTES", DEFAULT_MAX_REQUEST_BYTES);
        return new ServiceConfig(
                (int) parse(environment, "LOOPWRIGHT_PORT", DEFAULT_PORT),
                maxRequestBytes,
                (int) parse(
                        environment,
                        "LOOPWRIGHT_WORKER_THREADS",
                        Runtime.getRuntime().availableProcessors()),
                (int) parse(environment, "LOOPWRIGHT_QUEUE_CAPACITY", DEFAULT_QUEUE_CAPACITY),
                parse(environment, "LOOPWRIGHT_COMPUTE_DEADLINE_MS", DEFAULT_COMPUTE_DEADLINE_MILLIS),
                (int) parse(environment, "LOOPWRIGHT_MAX_BATCH_ITEMS", DEFAULT_MAX_BATCH_ITEMS),
                keys,
                fixedKeys,
                list(environment.get("LOOPWRIGHT_CORS_ORIGINS")),
                keyFile == null || keyFile.isBlank() ? null : keyFile.trim(),
                environment
                        .getOrDefault("LOOPWRIGHT_LOG_FORMAT", DEFAULT_LOG_FORMAT)
                        .trim()
                        .toLowerCase(Locale.ROOT),
                environment
                        .getOrDefault("LOOPWRIGHT_LOG_LEVEL", DEFAULT_LOG_LEVEL)
                        .trim()
                        .toUpperCase(Locale.ROOT),
                parse(environment, "LOOPWRIGHT_SHUTDOWN_GRACE_MS", DEFAULT_SHUTDOWN_GRACE_MILLIS),
                (int) parse(environment, "LOOPWRIGHT_METRICS_PORT", METRICS_ON_MAIN_PORT),
                new HttpLimits(
                        (int) parse(environment, "LOOPWRIGHT_HTTP_THREADS", HttpLimits.DEFAULT_HTTP_THREADS),
                        parse(
                                environment,
                                "LOOPWRIGHT_MAX_INFLIGHT_BODY_BYTES",
                                Math.max(HttpLimits.DEFAULT_INFLIGHT_BODY_BYTES, maxRequestBytes)),
                        parse(
                                environment,
                                "LOOPWRIGHT_MIN_BODY_BYTES_PER_S",
                                HttpLimits.DEFAULT_MIN_BODY_BYTES_PER_SECOND),
                        parse(environment, "LOOPWRIGHT_BODY_GRACE_MS", HttpLimits.DEFAULT_BODY_GRACE_MILLIS),
                        parse(environment, "LOOPWRIGHT_IDLE_TIMEOUT_MS", HttpLimits.DEFAULT_IDLE_TIMEOUT_MILLIS)),
                ServiceVersion.fromBuild());
    }

    public ServiceConfig withApiKeys(List<String> keys) {
        return new ServiceConfig(
                port,
                maxRequestBytes,
                workerThreads,
                queueCapacity,
                computeDeadlineMillis,
                maxBatchItems,
                keys,
                keys,
                corsOrigins,
                apiKeysFile,
                logFormat,
                logLevel,
                shutdownGraceMillis,
                metricsPort,
                http,
                serviceVersion);
    }

    /** The same settings answering as {@code version} (tests that record answers fix the version). */
    public ServiceConfig withServiceVersion(String version) {
        return new ServiceConfig(
                port,
                maxRequestBytes,
                workerThreads,
                queueCapacity,
                computeDeadlineMillis,
                maxBatchItems,
                apiKeys,
                fixedApiKeys,
                corsOrigins,
                apiKeysFile,
                logFormat,
                logLevel,
                shutdownGraceMillis,
                metricsPort,
                http,
                version);
    }

    /** Every setting by its variable name, with API keys masked (only their count is shown). */
    public Map<String, String> describe() {
        Map<String, String> shown = new LinkedHashMap<>();
        shown.put("LOOPWRIGHT_PORT", String.valueOf(port));
        shown.put("LOOPWRIGHT_MAX_REQUEST_BYTES", String.valueOf(maxRequestBytes));
        shown.put("LOOPWRIGHT_WORKER_THREADS", String.valueOf(workerThreads));
        shown.put("LOOPWRIGHT_QUEUE_CAPACITY", String.valueOf(queueCapacity));
        shown.put("LOOPWRIGHT_COMPUTE_DEADLINE_MS", String.valueOf(computeDeadlineMillis));
        shown.put("LOOPWRIGHT_MAX_BATCH_ITEMS", String.valueOf(maxBatchItems));
        shown.put(
                "LOOPWRIGHT_API_KEYS",
                apiKeys.isEmpty()
                        ? "(none: authentication off)"
                        : "****** (" + apiKeys.size() + " key" + (apiKeys.size() == 1 ? "" : "s") + ")");
        shown.put(
                "LOOPWRIGHT_CORS_ORIGINS", corsOrigins.isEmpty() ? "(none: CORS off)" : String.join(",", corsOrigins));
        shown.put(
                "LOOPWRIGHT_API_KEYS_FILE",
                apiKeysFile == null
                        ? "(none)"
                        : apiKeysFile + " (re-read every " + ApiKeysFile.POLL_INTERVAL_MILLIS + " ms)");
        shown.put("LOOPWRIGHT_LOG_FORMAT", logFormat);
        shown.put("LOOPWRIGHT_LOG_LEVEL", logLevel);
        shown.put("LOOPWRIGHT_SHUTDOWN_GRACE_MS", String.valueOf(shutdownGraceMillis));
        shown.put(
                "LOOPWRIGHT_METRICS_PORT",
                metricsPort == METRICS_ON_MAIN_PORT
                        ? "(none: /metrics on the main port)"
                        : String.valueOf(metricsPort));
        shown.put("LOOPWRIGHT_HTTP_THREADS", String.valueOf(http.httpThreads()));
        shown.put("LOOPWRIGHT_MAX_INFLIGHT_BODY_BYTES", String.valueOf(http.inFlightBodyBytes()));
        shown.put("LOOPWRIGHT_MIN_BODY_BYTES_PER_S", String.valueOf(http.minBodyBytesPerSecond()));
        shown.put("LOOPWRIGHT_BODY_GRACE_MS", String.valueOf(http.bodyGraceMillis()));
        shown.put("LOOPWRIGHT_IDLE_TIMEOUT_MS", String.valueOf(http.idleTimeoutMillis()));
        return shown;
    }

    /** Records print every component; keys must never reach a log through toString. */
    @Override
    public String toString() {
        return "ServiceConfig" + describe();
    }

    private static List<String> readKeyFile(Path file) {
        try {
            return ApiKeysFile.read(file);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read LOOPWRIGHT_API_KEYS_FILE " + file, e);
        }
    }

    private static List<String> list(String value) {
        if (value == null || value.isBlank()) {
            return List.of();
        }
        List<String> items = new ArrayList<>();
        for (String item : value.split(",")) {
            if (!item.isBlank()) {
                items.add(item.trim());
            }
        }
        return items;
    }

    private static long parse(Map<String, String> environment, String name, long fallback) {
        String value = environment.get(name);
        if (value == null || value.isBlank()) {
            return fallback;
        }
        try {
            return Long.parseLong(value.trim());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(name + " must be a whole number: " + value, e);
        }
    }
}
