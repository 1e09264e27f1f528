import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * The fairness check of bench/fairness.sh (a single-file program: java FairnessLoad.java BASE_URL ...): one client
 * sends the most expensive batches the compute budget allows, back to back, while another sends single designs one
 * at a time; the single designs' p99 latency must stay under FACTOR times its value without the batches, and no
 * single design may get a 5xx. Loopback only, bounded in time; exit status 1 when the condition fails.
 *
 * Arguments: base URL, warm-up seconds, unloaded seconds, loaded seconds (each 1-20), p99 factor.
 */
public final class FairnessLoad {

    /** The README's indexing axis: the single design. */
    static final String SINGLE = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";
    /** One item of 2036 work units: every coefficient +-10 % and 2000 Monte Carlo samples. */
    static final String HEAVY_ITEM = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5},\"verify\":{\"uncertainty\":{"
            + "\"a0\":{\"spreadPercent\":10},\"a1\":{\"spreadPercent\":10},\"b\":{\"spreadPercent\":10},"
            + "\"d\":{\"spreadPercent\":10},\"monteCarloSamples\":2000}}}";
    /** 24 x 2036 = 48864 of the 50000 units a request may cost: the most CPU per unit of the cost model. */
    static final int HEAVY_ITEMS = 24;
    /** Cap on the latencies kept per phase (one single design at a time cannot exceed it in 20 s). */
    static final int MAX_SAMPLES = 200_000;
    static final long PAUSE_MILLIS = 2;

    private final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private final URI design;
    private final URI batch;

    FairnessLoad(String base) {
        this.design = URI.create(base + "/v1/designs");
        this.batch = URI.create(base + "/v1/designs/batch");
    }

    private HttpResponse<String> post(URI uri, String body) throws Exception {
        return http.send(HttpRequest.newBuilder(uri).timeout(Duration.ofSeconds(60))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body)).build(),
                HttpResponse.BodyHandlers.ofString());
    }

    /** Single designs one at a time for the given time: latencies [ms] and the count of 5xx answers. */
    private double[] singles(long seconds, AtomicInteger serverErrors, AtomicInteger otherErrors) throws Exception {
        double[] latencies = new double[MAX_SAMPLES];
        int count = 0;
        long end = System.nanoTime() + seconds * 1_000_000_000L;
        while (System.nanoTime() < end && count < MAX_SAMPLES) {
            long start = System.nanoTime();
            int status = post(design, SINGLE).statusCode();
            latencies[count++] = (System.nanoTime() - start) / 1e6;
            if (status >= 500) {
                serverErrors.incrementAndGet();
            } else if (status != 200) {
                otherErrors.incrementAndGet();
            }
            Thread.sleep(PAUSE_MILLIS);
        }
        return Arrays.copyOf(latencies, count);
    }

    private static double percentile(double[] values, double p) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        return sorted.length == 0 ? Double.NaN : sorted[Math.min(sorted.length - 1, (int) Math.ceil(p / 100 * sorted.length) - 1)];
    }

    public static void main(String[] args) throws Exception {
        FairnessLoad load = new FairnessLoad(args[0]);
        long warmup = bounded(args[1]);
        long unloadedSeconds = bounded(args[2]);
        long loadedSeconds = bounded(args[3]);
        double factor = Double.parseDouble(args[4]);
        String heavy = "{\"items\":[" + String.join(",", Collections.nCopies(HEAVY_ITEMS, HEAVY_ITEM)) + "]}";

        AtomicInteger ignored = new AtomicInteger();
        load.singles(warmup, ignored, ignored);

        AtomicInteger unloadedServerErrors = new AtomicInteger();
        AtomicInteger unloadedOther = new AtomicInteger();
        double[] unloaded = load.singles(unloadedSeconds, unloadedServerErrors, unloadedOther);
        System.out.printf("unloaded single designs: n=%d p50=%.2f ms p99=%.2f ms 5xx=%d other-non-200=%d%n",
                unloaded.length, percentile(unloaded, 50), percentile(unloaded, 99), unloadedServerErrors.get(),
                unloadedOther.get());

        AtomicBoolean stop = new AtomicBoolean();
        AtomicInteger batches = new AtomicInteger();
        AtomicInteger batchStatusOther = new AtomicInteger();
        AtomicInteger firstBatchStatus = new AtomicInteger();
        List<Integer> lineStatuses = Collections.synchronizedList(new ArrayList<>());
        Thread heavyClient = new Thread(() -> {
            try {
                while (!stop.get()) {
                    HttpResponse<String> reply = load.post(load.batch, heavy);
                    batches.incrementAndGet();
                    firstBatchStatus.compareAndSet(0, reply.statusCode());
                    if (reply.statusCode() != 200) {
                        batchStatusOther.incrementAndGet();
                        continue;
                    }
                    for (String line : reply.body().split("\n")) {
                        int at = line.indexOf("\"status\":");
                        if (at >= 0 && lineStatuses.size() < MAX_SAMPLES) {
                            lineStatuses.add(Integer.parseInt(line.substring(at + 9, at + 12)));
                        }
                    }
                }
            } catch (Exception e) {
                batchStatusOther.incrementAndGet();
            }
        }, "heavy-client");
        heavyClient.setDaemon(true);
        heavyClient.start();
        Thread.sleep(500); // the first batch occupies its workers
        AtomicInteger loadedServerErrors = new AtomicInteger();
        AtomicInteger loadedOther = new AtomicInteger();
        double[] loaded = load.singles(loadedSeconds, loadedServerErrors, loadedOther);
        stop.set(true);
        heavyClient.join(1000); // a batch still running is not waited for (the service cancels it at its deadline)

        long lines200 = lineStatuses.stream().filter(s -> s == 200).count();
        long lines504 = lineStatuses.stream().filter(s -> s == 504).count();
        double unloadedP99 = percentile(unloaded, 99);
        double loadedP99 = percentile(loaded, 99);
        System.out.printf("loaded single designs:   n=%d p50=%.2f ms p99=%.2f ms 5xx=%d other-non-200=%d%n",
                loaded.length, percentile(loaded, 50), loadedP99, loadedServerErrors.get(), loadedOther.get());
        System.out.printf("heavy batches (%d items, 48864 work units each): %d answered (first: %d), %d not 200,"
                + " lines 200=%d 504=%d%n", HEAVY_ITEMS, batches.get(), firstBatchStatus.get(), batchStatusOther.get(),
                lines200, lines504);
        System.out.printf("p99 ratio loaded/unloaded = %.2f (must be < %.1f)%n", loadedP99 / unloadedP99, factor);
        boolean ok = loaded.length > 0 && unloaded.length > 0 && loadedP99 < factor * unloadedP99
                && loadedServerErrors.get() == 0 && unloadedServerErrors.get() == 0 && batches.get() > 0
                && batchStatusOther.get() == 0;
        System.out.println(ok ? "PASS" : "FAIL");
        System.exit(ok ? 0 : 1);
    }

    private static long bounded(String seconds) {
        long value = Long.parseLong(seconds);
        if (value < 1 || value > 20) {
            throw new IllegalArgumentException("each phase lasts 1-20 s: " + seconds);
        }
        return value;
    }
}
