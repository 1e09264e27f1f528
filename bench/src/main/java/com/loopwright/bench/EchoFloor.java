package com.loopwright.bench;

import io.javalin.Javalin;
import io.javalin.http.Context;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import org.eclipse.jetty.server.AbstractConnector;
import org.eclipse.jetty.server.Connector;
import org.eclipse.jetty.server.Server;
import org.eclipse.jetty.util.thread.QueuedThreadPool;

/**
 * The POST floor of {@code bench/e2e.sh}: a trivial Javalin server set up like the service's HTTP layer (the same
 * Javalin and Jetty from the parent pom, the same request-thread pool, header cap, request-size cap and idle timeout)
 * whose {@code POST /v1/designs} reads the whole request body and answers 200 with a recorded design response, the
 * recorded responses in turn, so that each answer has the size of a real one. It computes nothing, checks no key,
 * counts no metric and writes no log line: what the service does beyond it is the cost of a design request above
 * any POST of the same bytes. Bench code only; never part of the service.
 *
 * <pre>java -cp bench/target/loopwright-bench.jar com.loopwright.bench.EchoFloor PORT RESPONSE.json...</pre>
 */
public final class EchoFloor {

    /** The route the floor answers, the design route's path so that the same wrk script drives both. */
    public static final String PATH = "/v1/designs";
    /** Readiness for the bench scripts' start-up wait. */
    public static final String HEALTH_PATH = "/health";
    /** Recorded responses served in turn (at most this many). */
    public static final int MAX_RESPONSES = 64;

    /** The service's request body cap (ServiceConfig.DEFAULT_MAX_REQUEST_BYTES: 1 MiB). */
    static final long MAX_REQUEST_BYTES = 1L << 20;
    /** The service's Jetty request threads (HttpLimits.DEFAULT_HTTP_THREADS, Javalin's own default). */
    static final int HTTP_THREADS = 250;
    /** The service's minimum Jetty threads (HttpLimits.MIN_HTTP_THREADS). */
    static final int MIN_HTTP_THREADS = 8;
    /** The service's request line and header cap (HttpLimits.MAX_HEADER_BYTES). */
    static final int MAX_HEADER_BYTES = 8 * 1024;
    /** The service's connection idle timeout (HttpLimits.DEFAULT_IDLE_TIMEOUT_MILLIS) [ms]. */
    static final long IDLE_TIMEOUT_MILLIS = 30_000;

    private static final String JSON = "application/json";

    private EchoFloor() {}

    /** The floor serving {@code responses} in turn (not started). */
    public static Javalin create(List<byte[]> responses) {
        if (responses.isEmpty() || responses.size() > MAX_RESPONSES) {
            throw new IllegalArgumentException("1 to " + MAX_RESPONSES + " responses: " + responses.size());
        }
        List<byte[]> served = List.copyOf(responses);
        AtomicInteger next = new AtomicInteger();
        return Javalin.create(javalin -> {
            javalin.http.maxRequestSize = MAX_REQUEST_BYTES;
            javalin.http.prefer405over404 = true;
            javalin.startup.showJavalinBanner = false;
            javalin.startup.showOldJavalinVersionWarning = false;
            QueuedThreadPool threads = new QueuedThreadPool(HTTP_THREADS, MIN_HTTP_THREADS);
            threads.setName("echo-floor-http");
            javalin.jetty.threadPool = threads;
            javalin.jetty.modifyHttpConfiguration(http -> http.setRequestHeaderSize(MAX_HEADER_BYTES));
            // As in the service: Javalin adds its connector after modifyServer, so the idle timeout is set on it
            // just before the start.
            AtomicReference<Server> jetty = new AtomicReference<>();
            javalin.jetty.modifyServer(jetty::set);
            javalin.events.serverStarting(() -> {
                for (Connector connector : jetty.get().getConnectors()) {
                    if (connector instanceof AbstractConnector network) {
                        network.setIdleTimeout(IDLE_TIMEOUT_MILLIS);
                    }
                }
            });
            javalin.routes.post(
                    PATH, ctx -> echo(ctx, served.get(Math.floorMod(next.getAndIncrement(), served.size()))));
            javalin.routes.get(HEALTH_PATH, ctx -> ctx.contentType(JSON).result("{\"status\":\"UP\"}"));
        });
    }

    /** Reads the whole body (as the design route does), then answers the recorded bytes. */
    private static void echo(Context ctx, byte[] response) {
        byte[] body = ctx.bodyAsBytes();
        if (body.length == 0) {
            ctx.status(400).contentType(JSON).result("{\"detail\":\"empty body\"}");
            return;
        }
        ctx.status(200).contentType(JSON).result(response);
    }

    public static void main(String[] args) throws IOException {
        if (args.length < 2) {
            System.err.println("usage: EchoFloor PORT RESPONSE.json...");
            System.exit(2);
        }
        int port = Integer.parseInt(args[0]);
        List<byte[]> responses = new ArrayList<>();
        for (int i = 1; i < args.length; i++) {
            responses.add(Files.readAllBytes(Path.of(args[i])));
        }
        Javalin app = create(responses).start("127.0.0.1", port);
        Runtime.getRuntime().addShutdownHook(new Thread(app::stop, "echo-floor-stop"));
        System.out.println("echo floor on 127.0.0.1:" + app.port() + ", " + responses.size() + " recorded responses");
    }
}
