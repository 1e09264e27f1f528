package com.loopwright.bench;

import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponseMetrics;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Step metrics of the indexing-axis loop as every design verifies them: rise, settling, overshoot, peak time and
 * peak control on the 2,000-sample grid over three settling times, each event refined on the exact solution
 * between samples (2% band).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class StepMetricsBenchmark {

    /** Settling band of the indexing-axis spec. */
    public static final double BAND_FRACTION = 0.02;

    private final StepResponseMetrics metrics = new StepResponseMetrics();
    private LinearLoop loop;

    @Setup(Level.Trial)
    public void setUp() {
        loop = StepAccuracy.loop(Scenarios.indexingAxisTarget());
    }

    @Benchmark
    public StepMetrics measure() {
        return metrics.measure(
                loop, StepAccuracy.STEP_SIZE, StepAccuracy.HORIZON_SECONDS, StepAccuracy.SAMPLES, BAND_FRACTION);
    }
}
