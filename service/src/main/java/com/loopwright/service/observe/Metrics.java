package com.loopwright.service.observe;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryMXBean;
import java.lang.management.MemoryUsage;
import java.lang.management.ThreadMXBean;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.DoubleAdder;
import java.util.concurrent.atomic.LongAdder;
import java.util.function.IntSupplier;
import java.util.function.LongSupplier;

/**
 * Request and design metrics in the Prometheus text exposition format (version 0.0.4), written by hand: the
 * format is a small open standard, and a few counters and histograms do not justify a dependency.
 * Label values come from fixed sets (known routes, status codes, design outcomes), so cardinality is bounded.
 */
public final class Metrics {

    public static final String CONTENT_TYPE = "text/plain; version=0.0.4; charset=utf-8";
    /** Latency bucket upper bounds [s]: from a health check to a slow batch. */
    static final double[] LATENCY_BUCKETS_SECONDS = {
        0.0005, 0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30
    };
    /** Outcomes of one design computation (a request or a batch item). */
    public static final Set<String> DESIGN_OUTCOMES =
            Set.of("designed", "invalid", "infeasible", "unverifiable", "overloaded", "deadline", "failed");
    /** Guards the label space: at most this many (route, method, status) series, then one overflow series per
     * status class. */
    public static final int MAX_SERIES = 512;
    /**
     * Method label values: the methods of HTTP semantics (RFC 9110) and PATCH (RFC 5789), exactly as sent (methods
     * are case-sensitive); any other method name is counted as "other", so that a client cannot mint label values.
     */
    public static final Set<String> METHODS =
            Set.of("GET", "HEAD", "POST", "PUT", "DELETE", "CONNECT", "OPTIONS", "TRACE", "PATCH");
    /** Why the HTTP layer refused a request body (see RequestBodyGate). */
    public static final Set<String> BODY_REFUSALS = Set.of("too_large", "budget", "slow", "unreadable");

    private final Map<Series, Histogram> requests = new ConcurrentHashMap<>();
    private final Map<String, AtomicLong> designs = new ConcurrentHashMap<>();
    private final MemoryMXBean memory = ManagementFactory.getMemoryMXBean();
    private final ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    private final IntSupplier activeWorkers;
    private final IntSupplier queuedDesigns;
    private final AtomicLong inFlight = new AtomicLong();
    private final Map<String, LongAdder> bodyRefusals = new ConcurrentHashMap<>();
    private volatile LongSupplier availableBodyBytes = () -> -1;

    public Metrics(IntSupplier activeWorkers, IntSupplier queuedDesigns) {
        this.activeWorkers = activeWorkers;
        this.queuedDesigns = queuedDesigns;
        DESIGN_OUTCOMES.forEach(outcome -> designs.put(outcome, new AtomicLong()));
        BODY_REFUSALS.forEach(reason -> bodyRefusals.put(reason, new LongAdder()));
    }

    /** The gauge of the in-flight body budget not reserved (set once when the HTTP layer is built). */
    public void observeBodyBudget(LongSupplier available) {
        this.availableBodyBytes = available;
    }

    /** Counts one body refused by the HTTP layer; an unknown reason is not counted. */
    public void bodyRefused(String reason) {
        LongAdder counter = bodyRefusals.get(reason);
        if (counter != null) {
            counter.increment();
        }
    }

    /** The method as a label value: one of {@link #METHODS}, else "other". */
    public static String methodLabel(String method) {
        return method != null && METHODS.contains(method) ? method : "other";
    }

    public void requestStarted() {
        inFlight.incrementAndGet();
    }

    /**
     * Counts one finished request. {@code route} must already be a bounded label (a route template or "other");
     * the method is reduced to {@link #METHODS} or "other" here.
     */
    public void requestFinished(String route, String method, int status, double seconds) {
        inFlight.decrementAndGet();
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
        // A small record as the key: no label string is built per request (that happens only in scrape()).
        Series key = new Series(route, methodLabel(method), status >= 100 && status <= 599 ? status : 599);
        Histogram histogram = requests.get(key);
        if (histogram == null) {
            if (requests.size() >= MAX_SERIES) {
                key = new Series("other", "other", status / 100 * -1 - 1);
            }
            histogram = requests.computeIfAbsent(key, k -> new Histogram());
        }
        histogram.observe(seconds);
    }

    /**
     * One (route, method, status) series. A negative status -(c + 1) stands for the class "cxx" of the overflow
     * series.
     */
    private record Series(String route, String method, int status) {
        String labels() {
            if (status < 0) {
                return "route=\"" + route + "\",method=\"" + method + "\",status=\"" + (-status - 1) + "xx\"";
            }
            return "route=\"" + route + "\",method=\"" + method + "\",status=\"" + status + "\"";
        }
    }

    public long inFlight() {
        return inFlight.get();
    }

    /** Counts one design by outcome (see {@link #DESIGN_OUTCOMES}). */
    public void design(String outcome) {
        AtomicLong counter = designs.get(outcome);
        (counter == null ? designs.get("failed") : counter).incrementAndGet();
    }

    /** The outcome label of one design computation. */
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

    /** The whole exposition. */
    public String scrape() {
        StringBuilder out = new StringBuilder(4096);
        out.append("# HELP loopwright_http_requests_total HTTP requests by route, method and status.\n");
        out.append("# TYPE loopwright_http_requests_total counter\n");
        Map<String, Histogram> series = new TreeMap<>();
        requests.forEach((key, histogram) -> series.merge(key.labels(), histogram, Histogram::sum));
        series.forEach((labels, histogram) -> out.append("loopwright_http_requests_total{")
                .append(labels)
                .append("} ")
                .append(histogram.count())
                .append('\n'));
        out.append(
                "# HELP loopwright_http_request_duration_seconds HTTP request latency by route, method and status.\n");
        out.append("# TYPE loopwright_http_request_duration_seconds histogram\n");
        series.forEach((labels, histogram) -> histogram.write(out, "loopwright_http_request_duration_seconds", labels));
        out.append("# HELP loopwright_http_requests_in_flight Requests being served now.\n");
        out.append("# TYPE loopwright_http_requests_in_flight gauge\n");
        out.append("loopwright_http_requests_in_flight ").append(inFlight.get()).append('\n');
        out.append("# HELP loopwright_designs_total Design computations (requests and batch items) by outcome.\n");
        out.append("# TYPE loopwright_designs_total counter\n");
        designs.entrySet().stream()
                .sorted(Map.Entry.comparingByKey())
                .forEach(e -> out.append("loopwright_designs_total{outcome=\"")
                        .append(e.getKey())
                        .append("\"} ")
                        .append(e.getValue().get())
                        .append('\n'));
        out.append("# HELP loopwright_http_bodies_refused_total Request bodies the HTTP layer refused, by reason.\n");
        out.append("# TYPE loopwright_http_bodies_refused_total counter\n");
        bodyRefusals.entrySet().stream()
                .sorted(Map.Entry.comparingByKey())
                .forEach(e -> out.append("loopwright_http_bodies_refused_total{reason=\"")
                        .append(e.getKey())
                        .append("\"} ")
                        .append(e.getValue().sum())
                        .append('\n'));
        gauge(
                out,
                "loopwright_http_body_budget_available_bytes",
                "Bytes of the in-flight request body budget not reserved now.",
                availableBodyBytes.getAsLong());
        gauge(out, "loopwright_design_workers_active", "Design workers computing now.", activeWorkers.getAsInt());
        gauge(out, "loopwright_design_queue_length", "Designs waiting for a worker.", queuedDesigns.getAsInt());
        MemoryUsage heap = memory.getHeapMemoryUsage();
        MemoryUsage nonHeap = memory.getNonHeapMemoryUsage();
        out.append("# HELP jvm_memory_used_bytes Used JVM memory by area.\n");
        out.append("# TYPE jvm_memory_used_bytes gauge\n");
        out.append("jvm_memory_used_bytes{area=\"heap\"} ")
                .append(heap.getUsed())
                .append('\n');
        out.append("jvm_memory_used_bytes{area=\"nonheap\"} ")
                .append(nonHeap.getUsed())
                .append('\n');
        out.append("# HELP jvm_memory_committed_bytes Committed JVM memory by area.\n");
        out.append("# TYPE jvm_memory_committed_bytes gauge\n");
        out.append("jvm_memory_committed_bytes{area=\"heap\"} ")
                .append(heap.getCommitted())
                .append('\n');
        out.append("jvm_memory_committed_bytes{area=\"nonheap\"} ")
                .append(nonHeap.getCommitted())
                .append('\n');
        gauge(out, "jvm_memory_max_bytes", "Largest heap the JVM may use (-1 when undefined).", heap.getMax());
        gauge(out, "jvm_threads_live", "Live JVM threads.", threads.getThreadCount());
        gauge(out, "jvm_threads_peak", "Peak live JVM threads.", threads.getPeakThreadCount());
        return out.toString();
    }

    private static void gauge(StringBuilder out, String name, String help, long value) {
        out.append("# HELP ").append(name).append(' ').append(help).append('\n');
        out.append("# TYPE ").append(name).append(" gauge\n");
        out.append(name).append(' ').append(value).append('\n');
    }

    /**
     * Cumulative histogram: one counter per bucket, a total count and a sum, as LongAdder/DoubleAdder cells so
     * that request threads on different cores do not contend on one counter.
     */
    private static final class Histogram {
        private final LongAdder[] buckets = new LongAdder[LATENCY_BUCKETS_SECONDS.length];
        private final LongAdder count = new LongAdder();
        private final DoubleAdder sum = new DoubleAdder();

        Histogram() {
            for (int i = 0; i < buckets.length; i++) {
                buckets[i] = new LongAdder();
            }
        }

        void observe(double seconds) {
            for (int i = 0; i < LATENCY_BUCKETS_SECONDS.length; i++) {
                if (seconds <= LATENCY_BUCKETS_SECONDS[i]) {
                    buckets[i].increment();
                    break;
                }
            }
            sum.add(seconds);
            count.increment();
        }

        long count() {
            return count.sum();
        }

        /** Two series that print with the same labels (method names differing only in case) as one. */
        static Histogram sum(Histogram a, Histogram b) {
            Histogram total = new Histogram();
            for (Histogram h : new Histogram[] {a, b}) {
                for (int i = 0; i < h.buckets.length; i++) {
                    total.buckets[i].add(h.buckets[i].sum());
                }
                total.count.add(h.count.sum());
                total.sum.add(h.sum.sum());
            }
            return total;
        }

        void write(StringBuilder out, String name, String labels) {
            long cumulative = 0;
            for (int i = 0; i < LATENCY_BUCKETS_SECONDS.length; i++) {
                cumulative += buckets[i].sum();
                out.append(name)
                        .append("_bucket{")
                        .append(labels)
                        .append(",le=\"")
                        .append(LATENCY_BUCKETS_SECONDS[i])
                        .append("\"} ")
                        .append(cumulative)
                        .append('\n');
            }
            long total = count.sum();
            out.append(name)
                    .append("_bucket{")
                    .append(labels)
                    .append(",le=\"+Inf\"} ")
                    .append(Math.max(total, cumulative))
                    .append('\n');
            out.append(name)
                    .append("_sum{")
                    .append(labels)
                    .append("} ")
                    .append(sum.sum())
                    .append('\n');
            out.append(name)
                    .append("_count{")
                    .append(labels)
                    .append("} ")
                    .append(Math.max(total, cumulative))
                    .append('\n');
        }
    }
}
