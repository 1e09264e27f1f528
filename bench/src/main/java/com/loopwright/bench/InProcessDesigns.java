package com.loopwright.bench;

import com.loopwright.api.design.DesignEndpoint;
import com.loopwright.api.endpoint.EndpointRunner;
import com.loopwright.api.endpoint.Reply;
import com.loopwright.api.json.StrictJson;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicLong;

/**
 * The in-process limit of {@code bench/e2e.sh}: the designs the service computes, request bytes to response bytes
 * through the same exchange ({@link EndpointRunner} over {@link DesignEndpoint}, as the service's ExchangeDesigns
 * runs it), with no HTTP, on a fixed number of threads. Each thread designs the scenarios in turn for a warm-up
 * time, then for a measured time; the result is designs per second of wall-clock time and thread CPU time per
 * design (ThreadMXBean, so time slices taken by other processes are not charged).
 *
 * <pre>
 * java -cp bench/target/loopwright-bench.jar com.loopwright.bench.InProcessDesigns THREADS WARMUP_S SECONDS [all|readme]
 * </pre>
 *
 * {@code all} cycles the six e2e scenarios (the batch's items); {@code readme} repeats the README indexing axis
 * alone (the one-core comparison with the reference script). Prints one line starting with RESULT.
 */
public final class InProcessDesigns {

    /** Threads at most. */
    public static final int MAX_THREADS = 16;
    /** Warm-up and measured time at most, each [s]. */
    public static final double MAX_SECONDS = 120;
    /** Scenario lines read at most. */
    public static final int MAX_SCENARIOS = 64;
    /** The e2e scenarios, one request per line (read by bench/e2e.sh too). */
    public static final String SCENARIOS_RESOURCE = "/e2e-scenarios.ndjson";

    private static final long NANOS_PER_SECOND = 1_000_000_000L;

    private final EndpointRunner runner = new EndpointRunner(StrictJson.newMapper());
    private final DesignEndpoint endpoint = new DesignEndpoint();
    private final List<byte[]> requests;

    /**
     * @param threads         threads that designed
     * @param designs         designs finished in the measured time, all threads
     * @param wallSeconds     measured wall-clock time [s]
     * @param cpuSeconds      thread CPU time of the measured designs, all threads [s]
     * @param responseBytes   response bytes written in the measured time (the work is consumed, not dead code)
     */
    public record Measurement(int threads, long designs, double wallSeconds, double cpuSeconds, long responseBytes) {
        public double designsPerSecond() {
            return designs / wallSeconds;
        }

        public double cpuMicrosPerDesign() {
            return designs == 0 ? Double.NaN : 1e6 * cpuSeconds / designs;
        }

        /** One machine-readable line. */
        public String resultLine() {
            return String.format(
                    Locale.ROOT,
                    "RESULT threads=%d designs=%d wall_s=%.3f designs_per_s=%.1f cpu_us_per_design=%.2f bytes=%d",
                    threads,
                    designs,
                    wallSeconds,
                    designsPerSecond(),
                    cpuMicrosPerDesign(),
                    responseBytes);
        }
    }

    public InProcessDesigns(List<byte[]> requests) {
        if (requests.isEmpty() || requests.size() > MAX_SCENARIOS) {
            throw new IllegalArgumentException("1 to " + MAX_SCENARIOS + " requests: " + requests.size());
        }
        this.requests = List.copyOf(requests);
    }

    /** The e2e scenarios, in file order (the first one is the README indexing axis). */
    public static List<byte[]> e2eScenarios() {
        List<byte[]> lines = new ArrayList<>();
        try (InputStream in = InProcessDesigns.class.getResourceAsStream(SCENARIOS_RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("missing resource " + SCENARIOS_RESOURCE);
            }
            BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                if (!line.isBlank()) {
                    if (lines.size() == MAX_SCENARIOS) {
                        throw new IllegalStateException("more than " + MAX_SCENARIOS + " scenarios");
                    }
                    lines.add(line.strip().getBytes(StandardCharsets.UTF_8));
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return lines;
    }

    /** One design, bytes to bytes; a scenario that does not design is a broken benchmark. */
    public Reply design(int scenario) {
        Reply reply = runner.run(endpoint, requests.get(scenario));
        if (!reply.ok()) {
            throw new IllegalStateException("scenario " + scenario + " did not design: " + reply.problem());
        }
        return reply;
    }

    /** The length of a 200 body, without a copy. */
    static int bodyBytes(Reply reply) {
        try (InputStream body = reply.bodyStream()) {
            return body.available();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    public int scenarios() {
        return requests.size();
    }

    /** Designs on {@code threads} threads for the warm-up time, then counts them for the measured time. */
    public Measurement measure(int threads, double warmUpSeconds, double measuredSeconds) throws InterruptedException {
        if (threads < 1 || threads > MAX_THREADS) {
            throw new IllegalArgumentException("threads must be 1 to " + MAX_THREADS + ": " + threads);
        }
        checkSeconds(warmUpSeconds);
        checkSeconds(measuredSeconds);
        long start = System.nanoTime();
        long measureFrom = start + (long) (warmUpSeconds * NANOS_PER_SECOND);
        long measureTo = measureFrom + (long) (measuredSeconds * NANOS_PER_SECOND);
        AtomicLong designs = new AtomicLong();
        AtomicLong cpuNanos = new AtomicLong();
        AtomicLong bytes = new AtomicLong();
        AtomicLong lastStop = new AtomicLong(measureTo);
        List<Thread> workers = new ArrayList<>();
        List<Throwable> failures = java.util.Collections.synchronizedList(new ArrayList<>());
        for (int t = 0; t < threads; t++) {
            int offset = t; // threads start on different scenarios, as concurrent requests would
            Thread worker = new Thread(
                    () -> {
                        ThreadMXBean cpu = ManagementFactory.getThreadMXBean();
                        int next = offset;
                        while (System.nanoTime() < measureFrom) {
                            design(next++ % requests.size());
                        }
                        long cpuBefore = cpu.getCurrentThreadCpuTime();
                        long count = 0;
                        long written = 0;
                        while (System.nanoTime() < measureTo) {
                            written += bodyBytes(design(next++ % requests.size()));
                            count++;
                        }
                        long stopped = System.nanoTime();
                        cpuNanos.addAndGet(cpu.getCurrentThreadCpuTime() - cpuBefore);
                        designs.addAndGet(count);
                        bytes.addAndGet(written);
                        lastStop.accumulateAndGet(stopped, Math::max);
                    },
                    "in-process-design-" + t);
            worker.setUncaughtExceptionHandler((thread, error) -> failures.add(error));
            workers.add(worker);
        }
        workers.forEach(Thread::start);
        for (Thread worker : workers) {
            worker.join();
        }
        if (!failures.isEmpty()) {
            throw new IllegalStateException("a design thread failed", failures.get(0));
        }
        return new Measurement(
                threads,
                designs.get(),
                (lastStop.get() - measureFrom) / (double) NANOS_PER_SECOND,
                cpuNanos.get() / (double) NANOS_PER_SECOND,
                bytes.get());
    }

    private static void checkSeconds(double seconds) {
        if (!(seconds > 0 && seconds <= MAX_SECONDS)) {
            throw new IllegalArgumentException("seconds must be in (0, " + MAX_SECONDS + "]: " + seconds);
        }
    }

    public static void main(String[] args) throws InterruptedException {
        if (args.length < 3 || args.length > 4) {
            System.err.println("usage: InProcessDesigns THREADS WARMUP_S SECONDS [all|readme]");
            System.exit(2);
        }
        List<byte[]> scenarios = e2eScenarios();
        String which = args.length == 4 ? args[3] : "all";
        List<byte[]> requests = switch (which) {
            case "all" -> scenarios;
            case "readme" -> scenarios.subList(0, 1);
            default -> throw new IllegalArgumentException("all or readme: " + which);
        };
        Measurement result = new InProcessDesigns(requests)
                .measure(Integer.parseInt(args[0]), Double.parseDouble(args[1]), Double.parseDouble(args[2]));
        System.out.println(result.resultLine() + " scenarios=" + which);
    }
}
