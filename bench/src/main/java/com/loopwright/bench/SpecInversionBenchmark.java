package com.loopwright.bench;

import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.SpecInversion;
import com.loopwright.solver.spec.SpecInverter;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;

/** Specs to exact (zeta, wn): overshoot formula plus the root-found last band exit or rise time. */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class SpecInversionBenchmark {

    private final SpecInverter inverter = new SpecInverter();
    private final DesignSpec settling = Scenarios.indexingAxisSpec();
    private final DesignSpec rise = Scenarios.indexingAxisRiseSpec();

    @Benchmark
    public SpecInversion settlingTime() {
        return inverter.invert(settling);
    }

    @Benchmark
    public SpecInversion riseTime() {
        return inverter.invert(rise);
    }
}
