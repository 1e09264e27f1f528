package com.loopwright.service;

import static io.javalin.http.HandlerType.GET;
import static io.javalin.http.HandlerType.POST;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.designspace.DesignSpaceEndpoint;
import com.loopwright.api.designspace.DesignSpaceFigureEndpoint;
import com.loopwright.api.endpoint.Endpoint;
import com.loopwright.api.endpoint.EndpointRunner;
import com.loopwright.api.endpoint.Trace;
import com.loopwright.api.fit.FitEndpoint;
import com.loopwright.api.highorder.HighOrderEndpoint;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.takeaway.Takeaways;
import com.loopwright.api.verification.VerificationEndpoint;
import com.loopwright.service.compute.ComputePool;
import com.loopwright.service.compute.Designs;
import com.loopwright.service.compute.ExchangeDesigns;
import com.loopwright.service.http.CoreProblems;
import com.loopwright.service.http.HttpLimits;
import com.loopwright.service.http.ProblemErrorHandler;
import com.loopwright.service.http.ProblemException;
import com.loopwright.service.http.ProblemResponses;
import com.loopwright.service.http.RequestBodyGate;
import com.loopwright.service.http.StreamCuts;
import com.loopwright.service.observe.AccessLog;
import com.loopwright.service.observe.Metrics;
import com.loopwright.service.observe.RequestIds;
import com.loopwright.service.routes.BatchRoute;
import com.loopwright.service.routes.ContractRoute;
import com.loopwright.service.routes.DashboardRoute;
import com.loopwright.service.routes.HealthRoute;
import com.loopwright.service.routes.JsonExchangeRoute;
import com.loopwright.service.routes.MetricsRoute;
import com.loopwright.service.routes.ReadinessRoute;
import com.loopwright.service.routes.RouteTable;
import com.loopwright.service.routes.RouteTable.Route;
import com.loopwright.service.routes.TakeawayRoute;
import com.loopwright.service.security.ApiKeys;
import com.loopwright.service.security.ApiKeysFile;
import com.loopwright.service.security.Cors;
import com.loopwright.service.security.KeyedAccess;
import com.loopwright.service.security.SecurityHeaders;
import io.javalin.Javalin;
import io.javalin.http.Context;
import io.javalin.http.HttpResponseException;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.BiFunction;
import org.eclipse.jetty.ee10.servlet.ServletContextRequest;
import org.eclipse.jetty.server.AbstractConnector;
import org.eclipse.jetty.server.Connector;
import org.eclipse.jetty.server.Server;
import org.eclipse.jetty.server.ServerConnector;
import org.eclipse.jetty.server.handler.GracefulHandler;
import org.eclipse.jetty.util.thread.QueuedThreadPool;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.MDC;

/** Builds the Javalin application: routes, limits, security, observability and the problem+json error model. */
public final class LoopwrightApp {

    private static final Logger LOG = LoggerFactory.getLogger(LoopwrightApp.class);
    private static final String STARTED_NANOS = "loopwright.startedNanos";
    /** The name of the management connector (LOOPWRIGHT_METRICS_PORT) among the server's connectors. */
    public static final String METRICS_CONNECTOR = "management";

    private static final String DESIGNS_PATH = "/v1/designs";
    private static final String FIT_PATH = "/v1/models/fit";
    private static final String HIGH_ORDER_PATH = "/v1/designs/high-order";
    private static final String VERIFICATIONS_PATH = "/v1/verifications";
    private static final String DESIGN_SPACES_PATH = "/v1/design-spaces";
    private static final String DESIGN_SPACE_FIGURE_PATH = "/v1/design-spaces/figure";

    private LoopwrightApp() {}

    public static Javalin create(ServiceConfig config) {
        return create(config, null);
    }

    /** With a replaceable computation (tests use a slow one to exercise the deadline and back-pressure). */
    public static Javalin create(ServiceConfig config, Designs computation) {
        return create(config, computation, FatalErrors.haltingTheJvm());
    }

    /** With a replaceable reaction to an OutOfMemoryError (tests record it instead of halting the JVM). */
    public static Javalin create(ServiceConfig config, Designs computation, FatalErrors fatal) {
        return create(config, computation, fatal, ApiKeysFile.POLL_INTERVAL_MILLIS);
    }

    /** With the key file's poll interval (tests rotate keys in a fraction of a second). */
    public static Javalin create(ServiceConfig config, Designs computation, FatalErrors fatal, long keyFilePollMillis) {
        ObjectMapper mapper = StrictJson.newMapper();
        EndpointRunner runner = new EndpointRunner(mapper, config.serviceVersion());
        Designs designs = new OutOfMemoryGuard(computation == null ? new ExchangeDesigns(runner) : computation, fatal);
        ProblemResponses problems = new ProblemResponses(mapper);
        Metrics metrics = new Metrics(config.serviceVersion());
        ComputePool pool = new ComputePool(
                config.workerThreads(),
                config.queueCapacity(),
                config.computeDeadlineMillis(),
                new ComputePool.Timings(metrics::computationQueued, metrics::computationRan));
        metrics.observeComputePool(pool::activeWorkers, pool::queuedDesigns);
        StreamCuts cuts = new StreamCuts();
        AtomicBoolean draining = new AtomicBoolean();
        ApiKeys keys = new ApiKeys(config.apiKeys());
        // A mounted secret rotates without a restart: the key file is polled and re-read when it changes.
        ApiKeysFile keyFile = config.apiKeysFile() == null
                ? null
                : new ApiKeysFile(Path.of(config.apiKeysFile()), config.fixedApiKeys(), keys, keyFilePollMillis);
        Cors cors = new Cors(config.corsOrigins());
        JsonExchangeRoute design = JsonExchangeRoute.encoded(
                problems, pool, designs::design, outcome -> metrics.design(DESIGNS_PATH, outcome));
        BatchRoute batch = new BatchRoute(mapper, problems, designs, pool, metrics, config.maxBatchItems(), cuts);
        // A JSON-to-JSON endpoint on the compute pool, its fatal errors guarded and its outcomes counted under its
        // route template: one call per route-table row.
        BiFunction<String, Endpoint<?, ?, ?>, JsonExchangeRoute> json = (path, endpoint) -> JsonExchangeRoute.encoded(
                problems,
                pool,
                fatal.guard((byte[] body) -> runner.run(endpoint, body)),
                outcome -> metrics.computation(path, outcome));
        HealthRoute health = new HealthRoute();
        Takeaways takeaways = new Takeaways(runner);
        TakeawayRoute plots = new TakeawayRoute(
                "figure",
                fatal.guard(takeaways::plot),
                problems,
                pool,
                outcome -> metrics.computation(TakeawayRoute.PLOTS_PATH, outcome));
        TakeawayRoute controllers = new TakeawayRoute(
                "format",
                fatal.guard(takeaways::controller),
                problems,
                pool,
                outcome -> metrics.computation(TakeawayRoute.CONTROLLERS_PATH, outcome));
        DashboardRoute dashboard = new DashboardRoute();
        // Every endpoint, one line each: the table registers it, preflights it, keys it and labels its metrics.
        RouteTable table = new RouteTable(List.of(
                Route.keyed(POST, DESIGNS_PATH, design),
                Route.keyed(POST, BatchRoute.PATH, batch),
                Route.keyed(POST, FIT_PATH, json.apply(FIT_PATH, new FitEndpoint())),
                Route.keyed(POST, HIGH_ORDER_PATH, json.apply(HIGH_ORDER_PATH, new HighOrderEndpoint())),
                Route.keyed(POST, VERIFICATIONS_PATH, json.apply(VERIFICATIONS_PATH, new VerificationEndpoint())),
                Route.keyed(POST, DESIGN_SPACES_PATH, json.apply(DESIGN_SPACES_PATH, new DesignSpaceEndpoint())),
                Route.keyed(
                        POST,
                        DESIGN_SPACE_FIGURE_PATH,
                        json.apply(DESIGN_SPACE_FIGURE_PATH, new DesignSpaceFigureEndpoint())),
                Route.keyed(POST, TakeawayRoute.PLOTS_PATH, plots),
                Route.keyed(POST, TakeawayRoute.CONTROLLERS_PATH, controllers),
                Route.open(GET, ContractRoute.PATH, new ContractRoute()),
                Route.open(GET, HealthRoute.PATH, health),
                Route.open(GET, HealthRoute.LIVE_PATH, health),
                Route.open(GET, ReadinessRoute.PATH, new ReadinessRoute(draining::get, problems)),
                Route.open(GET, MetricsRoute.PATH, new MetricsRoute(metrics)),
                Route.open(GET, DashboardRoute.PATH, dashboard)));
        List.of(
                        DESIGNS_PATH,
                        BatchRoute.PATH,
                        FIT_PATH,
                        HIGH_ORDER_PATH,
                        VERIFICATIONS_PATH,
                        DESIGN_SPACES_PATH,
                        DESIGN_SPACE_FIGURE_PATH)
                .forEach(metrics::declareComputingRoute);
        metrics.declareComputingRoute(TakeawayRoute.PLOTS_PATH);
        metrics.declareComputingRoute(TakeawayRoute.CONTROLLERS_PATH);
        return Javalin.create(javalin -> {
            RouteTable.Matcher paths = table.matcher(javalin.router);
            KeyedAccess access = new KeyedAccess(keys, paths);
            // The key is checked from the headers before a body is admitted: without one, no body budget is reserved.
            RequestBodyGate bodies = new RequestBodyGate(
                    config.maxRequestBytes(),
                    config.http(),
                    new CoreProblems(mapper, config.serviceVersion()),
                    access::admitsBody,
                    gateObserver(metrics, paths));
            metrics.observeBodyBudget(bodies::availableBodyBytes);
            javalin.http.maxRequestSize = config.maxRequestBytes();
            javalin.http.prefer405over404 = true;
            javalin.startup.showJavalinBanner = false;
            javalin.startup.showOldJavalinVersionWarning = false;
            HttpLimits limits = config.http();
            AtomicReference<Server> jetty = new AtomicReference<>();
            QueuedThreadPool threads = new QueuedThreadPool(limits.httpThreads(), HttpLimits.MIN_HTTP_THREADS);
            threads.setName("loopwright-http");
            javalin.jetty.threadPool = threads;
            javalin.jetty.modifyHttpConfiguration(http -> http.setRequestHeaderSize(HttpLimits.MAX_HEADER_BYTES));
            // Graceful stop: Jetty refuses new requests and waits for in-flight ones up to the grace period. Bodies
            // are admitted and read by the gate (Javalin attaches its servlet inside it) before a thread serves them.
            javalin.jetty.modifyServer(server -> {
                GracefulHandler graceful = new GracefulHandler();
                graceful.setHandler(bodies);
                server.setHandler(graceful);
                server.setErrorHandler(new ProblemErrorHandler(mapper, fatal, config.serviceVersion()));
                server.setStopTimeout(config.shutdownGraceMillis());
                jetty.set(server);
            });
            // Javalin adds its connector after modifyServer; the idle timeout is set on it just before the start,
            // and the management connector (LOOPWRIGHT_METRICS_PORT) is added beside it, on the same host.
            AtomicReference<ServerConnector> management = new AtomicReference<>();
            javalin.events.serverStarting(() -> {
                Server server = jetty.get();
                if (config.metricsPort() != ServiceConfig.METRICS_ON_MAIN_PORT) {
                    ServerConnector metricsConnector = new ServerConnector(server);
                    metricsConnector.setName(METRICS_CONNECTOR);
                    metricsConnector.setPort(config.metricsPort());
                    if (server.getConnectors().length > 0
                            && server.getConnectors()[0] instanceof ServerConnector main) {
                        metricsConnector.setHost(main.getHost());
                    }
                    server.addConnector(metricsConnector);
                    management.set(metricsConnector);
                }
                for (Connector connector : server.getConnectors()) {
                    if (connector instanceof AbstractConnector network) {
                        network.setIdleTimeout(limits.idleTimeoutMillis());
                    }
                }
            });
            javalin.router.javaLangErrorHandler((response, error) -> {
                if (!fatal.check(error)) {
                    LOG.error("unhandled error on a request", error);
                }
                response.setStatus(500);
            });
            javalin.events.serverStopping(() -> {
                draining.set(true);
                cuts.cutBefore(config.shutdownGraceMillis());
            });
            javalin.events.serverStopped(() -> {
                if (keyFile != null) {
                    keyFile.close();
                }
                pool.shutdown(config.shutdownGraceMillis());
            });

            javalin.routes.before(ctx -> {
                ctx.attribute(STARTED_NANOS, System.nanoTime());
                metrics.requestStarted();
                String requestId = RequestIds.accept(ctx.header(RequestIds.HEADER));
                MDC.put(RequestIds.MDC_KEY, requestId);
                ctx.header(RequestIds.HEADER, requestId);
                ctx.header(Trace.VERSION_HEADER, config.serviceVersion());
                SecurityHeaders.apply(ctx);
                cors.decorate(ctx);
                keepMetricsOnItsPort(ctx, management.get());
                access.refuseWithheld(ctx);
            });
            table.register(javalin.routes, access::check, cors.enabled() ? cors::preflight : null);

            javalin.routes.exception(ProblemException.class, (e, ctx) -> {
                e.headers().forEach(ctx::header);
                problems.write(ctx, e.problem());
            });
            javalin.routes.exception(
                    HttpResponseException.class, (e, ctx) -> problems.write(ctx, statusProblem(e.getStatus())));
            javalin.routes.exception(Exception.class, (e, ctx) -> {
                LOG.error("unhandled failure on {} {}", ctx.method(), ctx.path(), e);
                problems.write(ctx, ProblemType.INTERNAL_ERROR.problem(null));
            });
            javalin.routes.error(404, ctx -> {
                if (!ProblemResponses.written(ctx)) {
                    problems.write(ctx, notFound());
                }
            });
            javalin.routes.error(405, ctx -> methodNotAllowed(ctx, table.methodsOn(paths.label(ctx.path())), problems));
            javalin.requestLogger.http((ctx, millis) -> finish(ctx, metrics, table, paths, keys));
        });
    }

    /**
     * With a management connector, GET /metrics is served there alone: the main port answers 404 on /metrics, the
     * management port 404 on every other path (a NetworkPolicy admits by port, not by path).
     */
    private static void keepMetricsOnItsPort(Context ctx, ServerConnector management) {
        if (management == null) {
            return;
        }
        boolean onManagementPort = ctx.req().getLocalPort() == management.getLocalPort();
        if (onManagementPort != ctx.path().equals(MetricsRoute.PATH)) {
            throw new ProblemException(ProblemType.NOT_FOUND.problem(
                    onManagementPort
                            ? "the management port serves GET " + MetricsRoute.PATH + " only"
                            : "metrics are served on the management port (LOOPWRIGHT_METRICS_PORT)"));
        }
    }

    /** 405 with the Allow header (RFC 9110, section 15.5.6) and the method to use in its detail. */
    private static void methodNotAllowed(Context ctx, List<String> allowed, ProblemResponses problems) {
        if (allowed.isEmpty()) {
            problems.write(ctx, ProblemType.METHOD_NOT_ALLOWED.problem("this method is not supported on this path"));
            return;
        }
        String methods = String.join(", ", allowed);
        ctx.header("Allow", methods);
        problems.write(
                ctx,
                ProblemType.METHOD_NOT_ALLOWED.problem(ctx.method().name() + " is not supported on this"
                        + " path; send " + (allowed.size() == 1 ? methods : "one of " + methods)));
    }

    /** Counts and logs the requests the body gate answers itself, labelled by the route their path fits. */
    private static RequestBodyGate.Observer gateObserver(Metrics metrics, RouteTable.Matcher paths) {
        return new RequestBodyGate.Observer() {
            @Override
            public void bodyRefused(String reason) {
                metrics.bodyRefused(reason);
            }

            @Override
            public void answered(String method, String path, int status, long elapsedNanos) {
                String route = paths.label(path);
                metrics.requestAnsweredByHttpLayer(route, method, status, elapsedNanos / 1e9);
                AccessLog.write(new AccessLog.Line(
                        Metrics.methodLabel(method), route, status, elapsedNanos / 1e9, -1, null, null, null));
            }
        };
    }

    /**
     * The matched route template (e.g. /v1/designs/plots/{figure}); without a matched endpoint (401, 404, 405), the
     * template the path fits; else "other": a bounded label set.
     */
    private static String routeLabel(Context ctx, RouteTable table, RouteTable.Matcher paths) {
        var matched = ctx.endpoints().lastHttpEndpoint();
        if (matched == null) {
            return paths.label(ctx.path());
        }
        return table.paths().contains(matched.path) ? matched.path : "other";
    }

    /** Counts the request, writes the access line and clears the request id from the thread. */
    private static void finish(Context ctx, Metrics metrics, RouteTable table, RouteTable.Matcher paths, ApiKeys keys) {
        Long started = ctx.attribute(STARTED_NANOS);
        double seconds = started == null ? 0 : (System.nanoTime() - started) / 1e9;
        String route = routeLabel(ctx, table, paths);
        int status = ctx.statusCode();
        if (started != null) {
            metrics.requestFinished(route, ctx.method().name(), status, seconds);
        }
        AccessLog.write(new AccessLog.Line(
                Metrics.methodLabel(ctx.method().name()),
                route,
                status,
                seconds,
                bytesWritten(ctx),
                keys.keyId(ctx.header("Authorization"), ctx.header(ApiKeys.HEADER)),
                ctx.header("User-Agent"),
                ctx.header(AccessLog.TRACEPARENT_HEADER)));
        MDC.remove(RequestIds.MDC_KEY);
    }

    /**
     * Response body bytes the application wrote for this exchange (some may still sit in the servlet's buffer when
     * the access line is written), or -1 when it cannot tell.
     */
    private static long bytesWritten(Context ctx) {
        ServletContextRequest request = ServletContextRequest.getServletContextRequest(ctx.req());
        return request == null
                ? -1
                : request.getServletContextResponse().getHttpOutput().getWritten();
    }

    /** The 404 of a path no route serves. */
    private static com.loopwright.api.problem.Problem notFound() {
        return ProblemType.NOT_FOUND.problem("no resource at this path; see GET /openapi.yaml");
    }

    private static com.loopwright.api.problem.Problem statusProblem(int status) {
        return switch (status) {
            case 404 -> notFound();
            case 405 -> ProblemType.METHOD_NOT_ALLOWED.problem(null);
            case 413 -> ProblemType.PAYLOAD_TOO_LARGE.problem("the body exceeds the request size cap");
            case 415 -> ProblemType.UNSUPPORTED_MEDIA_TYPE.problem(null);
            default ->
                status >= 500
                        ? ProblemType.INTERNAL_ERROR.problem(null)
                        : ProblemType.MALFORMED_REQUEST.problem("the request could not be read (HTTP " + status + ")");
        };
    }

    /** Hands an OutOfMemoryError of a design computation (on a worker thread) to {@link FatalErrors}. */
    private record OutOfMemoryGuard(Designs designs, FatalErrors fatal) implements Designs {
        @Override
        public com.loopwright.api.endpoint.Reply design(byte[] body) {
            try {
                return designs.design(body);
            } catch (OutOfMemoryError e) {
                fatal.check(e);
                throw e;
            }
        }

        @Override
        public com.loopwright.api.endpoint.Reply design(com.fasterxml.jackson.databind.JsonNode item) {
            try {
                return designs.design(item);
            } catch (OutOfMemoryError e) {
                fatal.check(e);
                throw e;
            }
        }

        @Override
        public com.loopwright.api.endpoint.Reply design(com.loopwright.service.compute.BatchItem item) {
            try {
                return designs.design(item);
            } catch (OutOfMemoryError e) {
                fatal.check(e);
                throw e;
            }
        }
    }
}
