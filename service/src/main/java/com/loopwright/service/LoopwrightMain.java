package com.loopwright.service;

import io.javalin.Javalin;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/** Entry point: reads the environment, prints the settings (keys masked), serves, drains on SIGTERM. */
public final class LoopwrightMain {

    private static final Logger LOG = LoggerFactory.getLogger(LoopwrightMain.class);

    private LoopwrightMain() {
    }

    public static void main(String[] args) {
        ServiceConfig config;
        try {
            config = ServiceConfig.fromEnvironment(System.getenv());
        } catch (RuntimeException e) {
            System.err.println("loopwright: " + e.getMessage());
            System.exit(2);
            return;
        }
        config.describe().forEach((name, value) -> LOG.info("config {}={}", name, value));
        Javalin app = LoopwrightApp.create(config).start(config.port());
        // SIGTERM runs the hook: readiness turns 503, Jetty refuses new requests and finishes in-flight ones
        // within LOOPWRIGHT_SHUTDOWN_GRACE_MS, then the design pool drains.
        Runtime.getRuntime().addShutdownHook(new Thread(() -> {
            LOG.info("shutdown requested: finishing in-flight requests");
            app.stop();
            LOG.info("stopped");
        }, "loopwright-shutdown"));
        LOG.info("Loopwright listening on port {}", app.port());
    }
}
