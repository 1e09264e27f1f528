package com.loopwright.service;

import ch.qos.logback.classic.LoggerContext;
import com.loopwright.service.observe.LogSettings;
import io.javalin.Javalin;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/** Entry point: reads the environment, prints the settings (keys masked), serves, drains on SIGTERM. */
public final class LoopwrightMain {

    private static final Logger LOG = LoggerFactory.getLogger(LoopwrightMain.class);

    private LoopwrightMain() {}

    public static void main(String[] args) {
        ServiceConfig config;
        try {
            config = ServiceConfig.fromEnvironment(System.getenv());
        } catch (RuntimeException e) {
            System.err.println("loopwright: " + e.getMessage());
            System.exit(2);
            return;
        }
        LogSettings.apply((LoggerContext) LoggerFactory.getILoggerFactory(), config.logFormat(), config.logLevel());
        FatalErrors fatal = FatalErrors.haltingTheJvm();
        // Any failure no code catches is one log line (one JSON object), and an OutOfMemoryError ends the process.
        Thread.setDefaultUncaughtExceptionHandler(fatal);
        config.describe().forEach((name, value) -> LOG.info("config {}={}", name, value));
        Javalin app = LoopwrightApp.create(config, null, fatal).start(config.port());
        // SIGTERM runs the hook: readiness turns 503, Jetty refuses new requests and finishes in-flight ones
        // within LOOPWRIGHT_SHUTDOWN_GRACE_MS (batch streams end with a cut line just before), then the pool drains.
        Runtime.getRuntime().addShutdownHook(new Thread(shutdownHook(app::stop), "loopwright-shutdown"));
        LOG.info("Loopwright listening on port {}", app.port());
        for (var connector : app.jettyServer().server().getConnectors()) {
            if (LoopwrightApp.METRICS_CONNECTOR.equals(connector.getName())
                    && connector instanceof org.eclipse.jetty.server.ServerConnector management) {
                LOG.info("metrics on the management port {}", management.getLocalPort());
            }
        }
    }

    /**
     * The shutdown hook's work: stop, and log a failure of the stop as one line. A hook thread's uncaught exception
     * would otherwise be printed as a plain-text stack trace in the middle of the JSON log.
     */
    static Runnable shutdownHook(Runnable stop) {
        return () -> {
            LOG.info("shutdown requested: finishing in-flight requests");
            try {
                stop.run();
                LOG.info("stopped");
            } catch (RuntimeException | Error e) {
                LOG.error("the stop did not finish cleanly", e);
            }
        };
    }
}
