package com.loopwright.service;

import java.util.Map;

/**
 * Settings read once at start-up from the environment.
 *
 * @param port            TCP port (LOOPWRIGHT_PORT, default 8080; 0 picks a free port)
 * @param maxRequestBytes request body cap in bytes (LOOPWRIGHT_MAX_REQUEST_BYTES, default 1 MiB)
 */
public record ServiceConfig(int port, long maxRequestBytes) {

    public static final int DEFAULT_PORT = 8080;
    public static final long DEFAULT_MAX_REQUEST_BYTES = 1L << 20;

    public ServiceConfig {
        if (port < 0 || port > 65_535) {
            throw new IllegalArgumentException("port must be from 0 to 65535: " + port);
        }
        if (maxRequestBytes < 1024 || maxRequestBytes > (64L << 20)) {
            throw new IllegalArgumentException("request cap must be from 1 KiB to 64 MiB: " + maxRequestBytes);
        }
    }

    public static ServiceConfig fromEnvironment(Map<String, String> environment) {
        return new ServiceConfig(
                parse(environment, "LOOPWRIGHT_PORT", DEFAULT_PORT),
                parse(environment, "LOOPWRIGHT_MAX_REQUEST_BYTES", DEFAULT_MAX_REQUEST_BYTES));
    }

    private static int parse(Map<String, String> environment, String name, int fallback) {
        return (int) parse(environment, name, (long) fallback);
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
