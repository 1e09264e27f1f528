package com.loopwright.bench;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;

/** Pole matching, the six gamma bounds and the closed-form Riccati entries for a known target. */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class ClosedFormDesignBenchmark {

    private final ClosedFormDesigner designer = new ClosedFormDesigner();
    private final CanonicalPlant plant = Scenarios.indexingAxisPlant();
    private final TargetDynamics target = Scenarios.indexingAxisTarget();
    private final GammaChoice margin = new GammaChoice.MarginOverMinimum(GammaChoice.MarginOverMinimum.DEFAULT_FACTOR);

    @Benchmark
    public ClosedFormDesign design() {
        return designer.design(plant, target, margin);
    }
}
