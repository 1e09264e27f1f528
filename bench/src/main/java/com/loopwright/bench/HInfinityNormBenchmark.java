package com.loopwright.bench;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.norm.TwoStatePeakGain;
import java.util.concurrent.TimeUnit;
import org.ejml.data.DMatrixRMaj;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;

/**
 * The closed-loop H-infinity norm from w to z = [rho1 x1, rho2 x2, u] of the indexing-axis design:
 * A_cl = [[0, 1], [-a0 - b k1, -a1 - b k2]], B1 = [0, d]', C_z = [[rho1, 0], [0, rho2], [-k1, -k2]];
 * by the general Hamiltonian iteration (any n) and by the exact two-state peak gain that designs use.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class HInfinityNormBenchmark {

    private final HInfinityNormCalculator calculator = new HInfinityNormCalculator();
    private final TwoStatePeakGain peakGain = new TwoStatePeakGain();
    private final DMatrixRMaj closedLoop;
    private final DMatrixRMaj disturbanceInput;
    private final DMatrixRMaj performanceOutput;

    public HInfinityNormBenchmark() {
        ClosedFormDesign design = Scenarios.indexingAxisDesign();
        double a0 = design.plant().a0();
        double a1 = design.plant().a1();
        double b = design.plant().b();
        double k1 = design.positionGain();
        double k2 = design.velocityGain();
        closedLoop = new DMatrixRMaj(new double[][] {{0, 1}, {-a0 - b * k1, -a1 - b * k2}});
        disturbanceInput = new DMatrixRMaj(new double[][] {{0}, {design.plant().d()}});
        performanceOutput = new DMatrixRMaj(new double[][] {{design.rho1(), 0}, {0, design.rho2()}, {-k1, -k2}});
    }

    @Benchmark
    public HInfinityNorm closedLoopNorm() {
        return calculator.compute(closedLoop, disturbanceInput, performanceOutput);
    }

    @Benchmark
    public HInfinityNorm twoStatePeakGain() {
        return peakGain.compute(closedLoop, disturbanceInput, performanceOutput);
    }
}
