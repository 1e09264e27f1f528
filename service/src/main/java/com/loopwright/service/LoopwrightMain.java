package com.loopwright.service;

import io.javalin.Javalin;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/** Entry point: reads the environment, starts the service, stops it cleanly on SIGTERM. */
public final class LoopwrightMain {

    private static final Logger LOG = LoggerFactory.getLogger(LoopwrightMain.class);

    private LoopwrightMain() {
    }

    public static void main(String[] args) {
        ServiceConfig config;
        try {
            config = ServiceConfig.fromEnvironment(System.getenv());
        } catch (IllegalArgumentException e) {
            System.err.println("loopwright: " + e.getMessage());
            System.exit(2);
            return;
        }
        Javalin app = LoopwrightApp.create(config).start(config.port());
        Runtime.getRuntime().addShutdownHook(new Thread(app::stop, "loopwright-shutdown"));
        LOG.info("Loopwright listening on port {} (request cap {} bytes)", app.port(), config.maxRequestBytes());
    }
}
