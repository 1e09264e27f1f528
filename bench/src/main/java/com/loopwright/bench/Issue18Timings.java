package com.loopwright.bench;

import java.util.List;

/**
 * CPU time per operation of the issue-18 targets (thread CPU time, median of {@value PairedRatios#ROUNDS} rounds of
 * 100 ms after {@value PairedRatios#WARMUP_ROUNDS} warm-up rounds, as {@link PairedRatios} measures), so that other
 * processes on a busy machine are not counted. Run with
 * {@code java -cp bench/target/loopwright-bench.jar com.loopwright.bench.Issue18Timings}.
 */
public final class Issue18Timings {

    private Issue18Timings() {}

    public static void main(String[] args) {
        RobustnessBenchmark benchmark = new RobustnessBenchmark();
        System.out.printf("load before: %s%n", loadAverage());
        for (PairedRatios.Pair operation : List.of(
                new PairedRatios.Pair(
                        "Monte Carlo 2000 samples, 4-parameter box (target 20 ms)", benchmark::monteCarlo2000, null),
                new PairedRatios.Pair(
                        "robust design, 4-parameter box, 200 samples (target 100 ms)",
                        benchmark::robustDesign200,
                        null),
                new PairedRatios.Pair("  the same as JSON bytes in and out", benchmark::robustDesignJson, null),
                new PairedRatios.Pair(
                        "order-8 spec-matched design, JSON (target 50 ms)", benchmark::order8SpecMatchedJson, null))) {
            double nanos = PairedRatios.single(operation.ours());
            System.out.printf("%-62s %8.2f ms CPU%n", operation.name(), nanos / 1e6);
        }
        System.out.printf("load after: %s%n", loadAverage());
    }

    private static String loadAverage() {
        return String.format(
                "%.2f (1-minute load average, %d cores)",
                java.lang.management.ManagementFactory.getOperatingSystemMXBean()
                        .getSystemLoadAverage(),
                Runtime.getRuntime().availableProcessors());
    }
}
