package com.loopwright.bench;

import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.riccati.RiccatiResidual;
import java.util.concurrent.TimeUnit;
import org.ejml.data.DMatrixRMaj;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RiccatiEquationSolverImpl;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The stabilizing Riccati solution of the same seeded LQ problem by our Hamiltonian sign-function solver and by
 * Hipparchus RiccatiEquationSolverImpl (its constructor does the whole solve). The setup prints the relative
 * residual ||A'P + PA + PRP + Q||_F / (||A'P||_F + ||PA||_F + ||PRP||_F + ||Q||_F) of both solutions.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class RiccatiBenchmark {

    @Param({"2", "4", "8"})
    public int n;

    private final HamiltonianRiccatiSolver solver = new HamiltonianRiccatiSolver();
    private DMatrixRMaj a;
    private DMatrixRMaj r;
    private DMatrixRMaj q;
    private RealMatrix hipparchusA;
    private RealMatrix hipparchusB;
    private RealMatrix hipparchusQ;
    private RealMatrix hipparchusControlWeight;

    @Setup(Level.Trial)
    public void setUp() {
        RiccatiCase problem = RiccatiCase.ofOrder(n);
        a = problem.a();
        r = problem.r();
        q = problem.q();
        hipparchusA = RiccatiCase.toHipparchus(problem.a());
        hipparchusB = RiccatiCase.toHipparchus(problem.b());
        hipparchusQ = RiccatiCase.toHipparchus(problem.q());
        hipparchusControlWeight = RiccatiCase.toHipparchus(problem.controlWeight());
        RiccatiComparison comparison = RiccatiComparison.of(problem);
        System.out.printf(
                "%nRiccati n = %d: relative residual ours %.3e, Hipparchus %.3e; relative P difference %.3e%n",
                n, comparison.ourResidual(), comparison.referenceResidual(), comparison.relativeDifference());
    }

    @Benchmark
    public RiccatiSolution hamiltonianSign() {
        return solver.solve(a, r, q);
    }

    @Benchmark
    public RealMatrix hipparchus() {
        return new RiccatiEquationSolverImpl(hipparchusA, hipparchusB, hipparchusQ, hipparchusControlWeight).getP();
    }

    /** Both residuals by the same formula, {@link RiccatiResidual#relative}, and the distance between the two P. */
    public record RiccatiComparison(double ourResidual, double referenceResidual, double relativeDifference) {

        public static RiccatiComparison of(RiccatiCase problem) {
            DMatrixRMaj ours = new HamiltonianRiccatiSolver()
                    .solve(problem.a(), problem.r(), problem.q())
                    .p();
            DMatrixRMaj reference = RiccatiCase.fromHipparchus(new RiccatiEquationSolverImpl(
                            RiccatiCase.toHipparchus(problem.a()), RiccatiCase.toHipparchus(problem.b()),
                            RiccatiCase.toHipparchus(problem.q()), RiccatiCase.toHipparchus(problem.controlWeight()))
                    .getP());
            double squaredDifference = 0;
            double squaredReference = 0;
            for (int i = 0; i < ours.getNumElements(); i++) {
                double delta = ours.data[i] - reference.data[i];
                squaredDifference += delta * delta;
                squaredReference += reference.data[i] * reference.data[i];
            }
            return new RiccatiComparison(
                    RiccatiResidual.relative(problem.a(), problem.r(), problem.q(), ours),
                    RiccatiResidual.relative(problem.a(), problem.r(), problem.q(), reference),
                    Math.sqrt(squaredDifference / squaredReference));
        }
    }
}
