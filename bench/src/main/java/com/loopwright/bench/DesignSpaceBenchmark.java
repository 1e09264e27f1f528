package com.loopwright.bench;

import com.loopwright.solver.design.DesignSpaceGrid;
import com.loopwright.solver.design.DesignSpaceMap;
import com.loopwright.solver.pipeline.DesignSpaceOptions;
import com.loopwright.solver.pipeline.DesignSpacePipeline;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.ParameterBox;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;

/**
 * The design-space target: a 64 x 64 map of the README indexing axis (settling 0.03..0.3 s, overshoot
 * 0.2..4.2 %, where almost every cell is feasible, so almost every cell is judged over the box) with a 2-parameter
 * box (b and d +-10%: 4 corners) and 0 or 16 seeded samples besides. JMH reports wall time; {@link #main} reports the
 * thread's CPU time per map (median of 9 after 5 warm-up maps), which a busy machine does not inflate.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class DesignSpaceBenchmark {

    static final CanonicalPlant AXIS = new CanonicalPlant(0, 0.48, 400, 400);
    static final DesignSpaceGrid GRID = new DesignSpaceGrid(true, 0.03, 0.3, 64, 0.2, 4.2, 64, 0.02);
    static final ParameterBox BOX = new ParameterBox(0, 0, 0.48, 0.48, 360, 440, 360, 440);

    private final DesignSpacePipeline maps = new DesignSpacePipeline();

    @Param({"0", "16"})
    public int samples;

    @Benchmark
    public DesignSpaceMap map64x64TwoParameterBox() {
        return maps.map(AXIS, GRID, new DesignSpaceOptions(3.0, 0.001, 1, BOX, samples, 1, 0.1));
    }

    /** CPU time of one map per box size: {@code java -cp bench/target/loopwright-bench.jar ...DesignSpaceBenchmark}. */
    public static void main(String[] args) {
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        DesignSpaceBenchmark benchmark = new DesignSpaceBenchmark();
        for (int samples : new int[] {0, 16, 256}) {
            benchmark.samples = samples;
            for (int i = 0; i < 5; i++) {
                benchmark.map64x64TwoParameterBox();
            }
            double[] millis = new double[9];
            for (int i = 0; i < millis.length; i++) {
                long start = threads.getCurrentThreadCpuTime();
                benchmark.map64x64TwoParameterBox();
                millis[i] = (threads.getCurrentThreadCpuTime() - start) / 1e6;
            }
            Arrays.sort(millis);
            System.out.printf(
                    "64 x 64 map, 2-parameter box, 4 corners + %d samples: CPU %.1f ms median (min %.1f, max %.1f)%n",
                    samples, millis[4], millis[0], millis[8]);
        }
    }
}
