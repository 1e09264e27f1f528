package com.loopwright.bench;

import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponse;
import com.loopwright.solver.simulation.StepSimulator;
import com.loopwright.solver.spec.TargetDynamics;
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
 * A 2,000-point step of the indexing-axis loop over three settling times: the exact ZOH recursion (including the
 * matrix exponential of its discretization) beside Hipparchus Dormand-Prince 8(5,3) at tolerance
 * {@value DormandPrinceStep#TOLERANCE}. The setup prints the largest output error of each against the analytic
 * second-order response.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class StepSimulationBenchmark {

    private final StepSimulator simulator = new StepSimulator();
    private TargetDynamics target;
    private LinearLoop loop;
    private DormandPrinceStep reference;

    @Setup(Level.Trial)
    public void setUp() {
        target = Scenarios.indexingAxisTarget();
        loop = StepAccuracy.loop(target);
        reference = new DormandPrinceStep(loop, StepAccuracy.STEP_SIZE);
        double zohError = StepAccuracy.maxOutputError(target, zeroOrderHold().output());
        double referenceError = StepAccuracy.maxOutputError(target, dormandPrince());
        System.out.printf(
                "%nstep, %d samples: max |y - y_analytic| ZOH %.3e, Dormand-Prince (tol %.0e) %.3e%n",
                StepAccuracy.SAMPLES, zohError, DormandPrinceStep.TOLERANCE, referenceError);
    }

    @Benchmark
    public StepResponse zeroOrderHold() {
        return simulator.simulate(loop, StepAccuracy.STEP_SIZE, StepAccuracy.HORIZON_SECONDS, StepAccuracy.SAMPLES);
    }

    @Benchmark
    public double[] dormandPrince() {
        return reference.simulate(StepAccuracy.HORIZON_SECONDS, StepAccuracy.SAMPLES);
    }
}
