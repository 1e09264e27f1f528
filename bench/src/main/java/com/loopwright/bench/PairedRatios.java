package com.loopwright.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.List;
import java.util.function.Supplier;

/**
 * Speed ratios that survive a busy machine: each pair (ours, reference) runs interleaved in rounds, A then B,
 * in one thread, and each side is charged the thread's CPU time (not wall time), so time slices lost to other
 * processes are not counted and both sides see the same machine state. Prints the median over the rounds of
 * the per-operation CPU time of each side and their ratio. Complements the JMH runs; run with
 * {@code java -cp bench/target/loopwright-bench.jar com.loopwright.bench.PairedRatios}. Also prints the CPU time
 * of one whole design (solver pipeline, and JSON exchange).
 */
public final class PairedRatios {

    /** Interleaved rounds per pair; the median over them is reported. */
    static final int ROUNDS = 21;

    /** CPU time each side gets per round (and per warm-up round) [ns]. */
    static final long ROUND_CPU_NANOS = 100_000_000L;

    /** Warm-up rounds per pair before measuring (lets the JIT compile both sides). */
    static final int WARMUP_ROUNDS = 10;

    /** Operations per round are capped so that a stalled clock cannot loop forever. */
    static final int MAX_OPERATIONS_PER_ROUND = 1_000_000;

    private static final ThreadMXBean THREADS = ManagementFactory.getThreadMXBean();

    private PairedRatios() {}

    /** A named pair of operations: ours and the reference. */
    record Pair(String name, Supplier<Object> ours, Supplier<Object> reference) {}

    /** Median CPU time per operation of each side [ns] and reference / ours. */
    record Ratio(String name, double oursNanos, double referenceNanos) {
        double speedup() {
            return referenceNanos / oursNanos;
        }
    }

    public static void main(String[] args) {
        if (!THREADS.isCurrentThreadCpuTimeSupported()) {
            throw new IllegalStateException("this JVM cannot measure thread CPU time");
        }
        StepSimulationBenchmark step = new StepSimulationBenchmark();
        step.setUp();
        List<Pair> pairs = new java.util.ArrayList<>();
        pairs.add(new Pair(
                "step 2000 samples: ZOH vs Dormand-Prince tol 1e-12", step::zeroOrderHold, step::dormandPrince));
        for (int n : new int[] {2, 4, 8}) {
            RiccatiBenchmark riccati = new RiccatiBenchmark();
            riccati.n = n;
            riccati.setUp();
            pairs.add(new Pair(
                    "Riccati n = " + n + ": Hamiltonian sign vs Hipparchus",
                    riccati::hamiltonianSign,
                    riccati::hipparchus));
        }
        System.out.printf("load before: %s%n", loadAverage());
        for (Pair pair : pairs) {
            Ratio ratio = measure(pair);
            System.out.printf(
                    "%-55s ours %10.1f us  reference %10.1f us  speedup %6.1fx%n",
                    ratio.name(), ratio.oursNanos() / 1e3, ratio.referenceNanos() / 1e3, ratio.speedup());
        }
        // No reference for a whole design: its CPU time bounds the designs per second a core can serve.
        DesignBenchmark design = new DesignBenchmark();
        // The step metrics are the largest part of a design's verification.
        StepMetricsBenchmark stepMetrics = new StepMetricsBenchmark();
        stepMetrics.setUp();
        System.out.printf(
                "%-55s %10.1f us CPU per call%n",
                "step metrics, 2000 samples (one design's share)", single(stepMetrics::measure) / 1e3);
        for (Pair single : List.of(
                new Pair("design: solver pipeline", design::solverPipeline, null),
                new Pair("design: JSON bytes in, JSON bytes out (service path)", design::jsonEncode, null))) {
            double nanos = single(single.ours());
            System.out.printf(
                    "%-55s %10.1f us CPU per design = %8.0f designs/s per core%n",
                    single.name(), nanos / 1e3, 1e9 / nanos);
        }
        System.out.printf("load after: %s%n", loadAverage());
    }

    static double single(Supplier<Object> operation) {
        for (int round = 0; round < WARMUP_ROUNDS; round++) {
            cpuNanosPerOperation(operation);
        }
        double[] nanos = new double[ROUNDS];
        for (int round = 0; round < ROUNDS; round++) {
            nanos[round] = cpuNanosPerOperation(operation);
        }
        return median(nanos);
    }

    static Ratio measure(Pair pair) {
        for (int round = 0; round < WARMUP_ROUNDS; round++) {
            cpuNanosPerOperation(pair.ours());
            cpuNanosPerOperation(pair.reference());
        }
        double[] ours = new double[ROUNDS];
        double[] reference = new double[ROUNDS];
        for (int round = 0; round < ROUNDS; round++) {
            ours[round] = cpuNanosPerOperation(pair.ours());
            reference[round] = cpuNanosPerOperation(pair.reference());
        }
        return new Ratio(pair.name(), median(ours), median(reference));
    }

    /** Runs the operation until it has used ROUND_CPU_NANOS of this thread's CPU; returns CPU ns per call. */
    private static double cpuNanosPerOperation(Supplier<Object> operation) {
        long start = THREADS.getCurrentThreadCpuTime();
        long used = 0;
        int calls = 0;
        int sink = 0;
        while (used < ROUND_CPU_NANOS && calls < MAX_OPERATIONS_PER_ROUND) {
            sink += System.identityHashCode(operation.get()) & 1;
            calls++;
            used = THREADS.getCurrentThreadCpuTime() - start;
        }
        if (sink < 0) {
            throw new AssertionError("unreachable: keeps the results alive");
        }
        return (double) used / calls;
    }

    private static double median(double[] values) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        return sorted[sorted.length / 2];
    }

    private static String loadAverage() {
        return String.format(
                "%.2f (1-minute load average, %d cores)",
                ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(),
                Runtime.getRuntime().availableProcessors());
    }
}
