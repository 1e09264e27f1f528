package com.loopwright.service.observe;

import io.prometheus.metrics.config.EscapingScheme;
import io.prometheus.metrics.core.datapoints.CounterDataPoint;
import io.prometheus.metrics.core.datapoints.DistributionDataPoint;
import io.prometheus.metrics.core.metrics.Counter;
import io.prometheus.metrics.core.metrics.Gauge;
import io.prometheus.metrics.core.metrics.GaugeWithCallback;
import io.prometheus.metrics.core.metrics.Histogram;
import io.prometheus.metrics.core.metrics.Info;
import io.prometheus.metrics.expositionformats.PrometheusTextFormatWriter;
import io.prometheus.metrics.instrumentation.jvm.JvmBufferPoolMetrics;
import io.prometheus.metrics.instrumentation.jvm.JvmClassLoadingMetrics;
import io.prometheus.metrics.instrumentation.jvm.JvmCompilationMetrics;
import io.prometheus.metrics.instrumentation.jvm.JvmGarbageCollectorMetrics;
import io.prometheus.metrics.instrumentation.jvm.JvmMemoryMetrics;
import io.prometheus.metrics.instrumentation.jvm.JvmRuntimeInfoMetric;
import io.prometheus.metrics.instrumentation.jvm.JvmThreadsMetrics;
import io.prometheus.metrics.instrumentation.jvm.ProcessMetrics;
import io.prometheus.metrics.model.registry.PrometheusRegistry;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.IntSupplier;
import java.util.function.LongSupplier;

/**
 * The service's Prometheus metrics, kept by the Prometheus Java client in a registry of this instance (never the
 * client's process-wide default registry): the client's JVM instrumentation (the standard jvm_* and process_*
 * series), the build info, HTTP requests by route, method and status, computations by route and outcome, the
 * compute pool's queue wait and compute time, and the HTTP layer's body refusals. Label values come from fixed
 * sets (route templates of the route table, methods, status codes, outcomes, refusal reasons); a client can never
 * mint one.
 */
public final class Metrics {

    /** The Prometheus text exposition format, version 0.0.4. */
    public static final String CONTENT_TYPE = PrometheusTextFormatWriter.CONTENT_TYPE;
    /** Latency bucket upper bounds [s]: from a health check to a slow batch. */
    static final double[] LATENCY_BUCKETS_SECONDS = {
        0.0005, 0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30
    };
    /** Outcomes of one design computation (a request or a batch item): loopwright_designs_total. */
    public static final Set<String> DESIGN_OUTCOMES =
            Set.of("designed", "invalid", "infeasible", "unverifiable", "overloaded", "deadline", "failed");
    /**
     * Outcomes of one computation of any computing route (designs, batch items, order n, fits, verifications,
     * plots, controller exports): loopwright_computations_total. "ok" is an answer; the others name the problem.
     */
    public static final Set<String> COMPUTATION_OUTCOMES =
            Set.of("ok", "invalid", "infeasible", "unverifiable", "overloaded", "deadline", "failed");
    /** Guards the label space: at most this many (route, method, status) series, then one overflow series per
     * status class. */
    public static final int MAX_SERIES = 512;
    /** At most this many computing routes (each with the fixed outcome set). */
    public static final int MAX_COMPUTING_ROUTES = 32;
    /**
     * Method label values: the methods of HTTP semantics (RFC 9110) and PATCH (RFC 5789), exactly as sent (methods
     * are case-sensitive); any other method name is counted as "other", so that a client cannot mint label values.
     */
    public static final Set<String> METHODS =
            Set.of("GET", "HEAD", "POST", "PUT", "DELETE", "CONNECT", "OPTIONS", "TRACE", "PATCH");
    /** Why the HTTP layer refused a request body (see RequestBodyGate). */
    public static final Set<String> BODY_REFUSALS = Set.of("too_large", "budget", "slow", "unreadable");

    private static final String OVERFLOW = "other";

    private final PrometheusRegistry registry = new PrometheusRegistry();
    private final PrometheusTextFormatWriter writer =
            PrometheusTextFormatWriter.builder().build();
    private final Counter requests;
    private final Histogram requestSeconds;
    private final Gauge inFlight;
    private final Counter designs;
    private final Counter computations;
    private final Counter bodyRefusals;
    private final Histogram queueWaitSeconds;
    private final Histogram computeSeconds;
    /** The data points of each (route, method, status) series, looked up once per series, not per request. */
    private final Map<Series, RequestPoints> series = new ConcurrentHashMap<>();

    private final Set<String> computingRoutes = ConcurrentHashMap.newKeySet();
    private volatile LongSupplier availableBodyBytes = () -> -1;
    private volatile IntSupplier activeWorkers = () -> 0;
    private volatile IntSupplier queuedComputations = () -> 0;

    /** @param version the service version, the label of loopwright_build_info */
    public Metrics(String version) {
        // The components of the client's JvmMetrics, one by one: JvmMetrics itself remembers every registry it
        // registered with in a static set (so every application built in one JVM, as in tests, would stay
        // reachable), and its allocation counters add a GC listener per registry that is never removed.
        JvmThreadsMetrics.builder().register(registry);
        JvmBufferPoolMetrics.builder().register(registry);
        JvmClassLoadingMetrics.builder().register(registry);
        JvmCompilationMetrics.builder().register(registry);
        JvmGarbageCollectorMetrics.builder().register(registry);
        JvmMemoryMetrics.builder().register(registry);
        JvmRuntimeInfoMetric.builder().register(registry);
        ProcessMetrics.builder().register(registry);
        Info.builder()
                .name("loopwright_build_info")
                .help("The running build: its version (always 1).")
                .labelNames("version")
                .register(registry)
                .setLabelValues(version);
        requests = Counter.builder()
                .name("loopwright_http_requests_total")
                .help("HTTP requests by route, method and status.")
                .labelNames("route", "method", "status")
                .withoutExemplars()
                .register(registry);
        requestSeconds = Histogram.builder()
                .name("loopwright_http_request_duration_seconds")
                .help("HTTP request latency by route, method and status.")
                .labelNames("route", "method", "status")
                .classicUpperBounds(LATENCY_BUCKETS_SECONDS)
                .classicOnly()
                .withoutExemplars()
                .register(registry);
        inFlight = Gauge.builder()
                .name("loopwright_http_requests_in_flight")
                .help("Requests being served now.")
                .withoutExemplars()
                .register(registry);
        designs = Counter.builder()
                .name("loopwright_designs_total")
                .help("Design computations (requests and batch items) by outcome.")
                .labelNames("outcome")
                .withoutExemplars()
                .register(registry);
        DESIGN_OUTCOMES.forEach(outcome -> designs.labelValues(outcome));
        computations = Counter.builder()
                .name("loopwright_computations_total")
                .help("Computations of every computing route (a batch counts each item) by route and outcome.")
                .labelNames("route", "outcome")
                .withoutExemplars()
                .register(registry);
        bodyRefusals = Counter.builder()
                .name("loopwright_http_bodies_refused_total")
                .help("Request bodies the HTTP layer refused, by reason.")
                .labelNames("reason")
                .withoutExemplars()
                .register(registry);
        BODY_REFUSALS.forEach(reason -> bodyRefusals.labelValues(reason));
        queueWaitSeconds = Histogram.builder()
                .name("loopwright_compute_queue_wait_seconds")
                .help("Time a computation waited in the compute pool's queue before a worker took it.")
                .classicUpperBounds(LATENCY_BUCKETS_SECONDS)
                .classicOnly()
                .withoutExemplars()
                .register(registry);
        computeSeconds = Histogram.builder()
                .name("loopwright_compute_duration_seconds")
                .help("Time a worker spent on one computation (to its answer, its failure or its cancellation).")
                .classicUpperBounds(LATENCY_BUCKETS_SECONDS)
                .classicOnly()
                .withoutExemplars()
                .register(registry);
        GaugeWithCallback.builder()
                .name("loopwright_http_body_budget_available_bytes")
                .help("Bytes of the in-flight request body budget not reserved now.")
                .callback(callback -> callback.call(availableBodyBytes.getAsLong()))
                .register(registry);
        GaugeWithCallback.builder()
                .name("loopwright_design_workers_active")
                .help("Compute workers computing now.")
                .callback(callback -> callback.call(activeWorkers.getAsInt()))
                .register(registry);
        GaugeWithCallback.builder()
                .name("loopwright_design_queue_length")
                .help("Computations waiting for a compute worker.")
                .callback(callback -> callback.call(queuedComputations.getAsInt()))
                .register(registry);
    }

    /** The gauge of the in-flight body budget not reserved (set once when the HTTP layer is built). */
    public void observeBodyBudget(LongSupplier available) {
        this.availableBodyBytes = available;
    }

    /** The gauges of the compute pool (set once when the pool is built). */
    public void observeComputePool(IntSupplier active, IntSupplier queued) {
        this.activeWorkers = active;
        this.queuedComputations = queued;
    }

    /** One computation waited this long in the pool's queue. */
    public void computationQueued(long nanos) {
        queueWaitSeconds.observe(nanos / 1e9);
    }

    /** One computation kept a worker this long. */
    public void computationRan(long nanos) {
        computeSeconds.observe(nanos / 1e9);
    }

    /** Counts one body refused by the HTTP layer; an unknown reason is not counted. */
    public void bodyRefused(String reason) {
        if (BODY_REFUSALS.contains(reason)) {
            bodyRefusals.labelValues(reason).inc();
        }
    }

    /** The method as a label value: one of {@link #METHODS}, else "other". */
    public static String methodLabel(String method) {
        return method != null && METHODS.contains(method) ? method : OVERFLOW;
    }

    public void requestStarted() {
        inFlight.inc();
    }

    /**
     * Counts one finished request. {@code route} must already be a bounded label (a route template or "other");
     * the method is reduced to {@link #METHODS} or "other" here.
     */
    public void requestFinished(String route, String method, int status, double seconds) {
        inFlight.dec();
        count(route, method, status, seconds);
    }

    /**
     * Counts one request the HTTP layer answered before the application saw it (a refused body: 413, 408, 400,
     * 503); it was never in flight. The same bounded labels as {@link #requestFinished}.
     */
    public void requestAnsweredByHttpLayer(String route, String method, int status, double seconds) {
        count(route, method, status, seconds);
    }

    private void count(String route, String method, int status, double seconds) {
        Series key = new Series(route, methodLabel(method), status >= 100 && status <= 599 ? status : 599);
        RequestPoints points = series.get(key);
        if (points == null) {
            if (series.size() >= MAX_SERIES) {
                key = new Series(OVERFLOW, OVERFLOW, -(key.status / 100) - 1);
            }
            points = series.computeIfAbsent(key, this::points);
        }
        points.count.inc();
        points.seconds.observe(seconds);
    }

    private RequestPoints points(Series key) {
        String status = key.status < 0 ? (-key.status - 1) + "xx" : String.valueOf(key.status);
        return new RequestPoints(
                requests.labelValues(key.route, key.method, status),
                requestSeconds.labelValues(key.route, key.method, status));
    }

    /** One (route, method, status) series; a negative status -(c + 1) stands for the overflow class "cxx". */
    private record Series(String route, String method, int status) {}

    private record RequestPoints(CounterDataPoint count, DistributionDataPoint seconds) {}

    public long inFlight() {
        return (long) inFlight.get();
    }

    /**
     * Counts one design computation (a POST /v1/designs or one batch item) by its design outcome, and as a
     * computation of {@code route}.
     */
    public void design(String route, com.loopwright.api.endpoint.Reply outcome) {
        String label = outcomeOf(outcome);
        designs.labelValues(DESIGN_OUTCOMES.contains(label) ? label : "failed").inc();
        computation(route, outcome);
    }

    /**
     * Counts one computation of a computing route by outcome. {@code route} is a route template the application
     * names in code (never a request's path); past {@link #MAX_COMPUTING_ROUTES} routes it counts as "other".
     */
    public void computation(String route, com.loopwright.api.endpoint.Reply outcome) {
        String label = outcomeOf(outcome);
        computations
                .labelValues(declareComputingRoute(route), label.equals("designed") ? "ok" : label)
                .inc();
    }

    /**
     * Makes the series of a computing route exist (at zero, for every outcome) before its first request; returns
     * the route's label: the route itself, or "other" past {@link #MAX_COMPUTING_ROUTES} routes.
     */
    public String declareComputingRoute(String route) {
        if (!computingRoutes.contains(route)) {
            synchronized (computingRoutes) {
                if (!computingRoutes.contains(route)) {
                    if (computingRoutes.size() >= MAX_COMPUTING_ROUTES) {
                        return OVERFLOW;
                    }
                    COMPUTATION_OUTCOMES.forEach(each -> computations.labelValues(route, each));
                    computingRoutes.add(route);
                }
            }
        }
        return route;
    }

    /** The design outcome label of one computation: "designed" for an answer, else the problem's kind. */
    public static String outcomeOf(com.loopwright.api.endpoint.Reply outcome) {
        return outcomeOf(outcome.status(), outcome.problem());
    }

    private static String outcomeOf(int status, com.loopwright.api.problem.Problem problem) {
        if (problem == null) {
            return "designed";
        }
        String type = problem.type();
        if (type.equals(com.loopwright.api.problem.ProblemType.INFEASIBLE_SPEC.uri())) {
            return "infeasible";
        }
        if (type.equals(com.loopwright.api.problem.ProblemType.UNVERIFIABLE_DESIGN.uri())) {
            return "unverifiable";
        }
        if (type.equals(com.loopwright.api.problem.ProblemType.SERVICE_OVERLOADED.uri())) {
            return "overloaded";
        }
        if (type.equals(com.loopwright.api.problem.ProblemType.DEADLINE_EXCEEDED.uri())) {
            return "deadline";
        }
        return status < 500 ? "invalid" : "failed";
    }

    /** The whole exposition in the Prometheus text format 0.0.4 (classic metric names, underscores only). */
    public byte[] scrape() {
        ByteArrayOutputStream out = new ByteArrayOutputStream(16 * 1024);
        try {
            writer.write(out, registry.scrape(), EscapingScheme.UNDERSCORE_ESCAPING);
        } catch (IOException e) {
            throw new UncheckedIOException("a byte array stream does not fail", e);
        }
        return out.toByteArray();
    }

    /** {@link #scrape()} as text (tests, diagnostics). */
    public String scrapeText() {
        return new String(scrape(), java.nio.charset.StandardCharsets.UTF_8);
    }
}
