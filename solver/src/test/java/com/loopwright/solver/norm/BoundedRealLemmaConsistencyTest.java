package com.loopwright.solver.norm;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.riccati.NoStabilizingSolutionException;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

/**
 * Cross-check of the two components through the bounded real lemma (textbook fact): for Hurwitz A,
 * ||C (sI - A)^-1 B||inf < gamma iff A'X + XA + X B B' X / gamma^2 + C'C = 0 has a stabilizing
 * solution. The norm is computed by Hamiltonian eigenvalue tests, the Riccati solution by the matrix
 * sign function, so the two code paths are distinct.
 */
class BoundedRealLemmaConsistencyTest {

    private final HInfinityNormCalculator calculator = new HInfinityNormCalculator();
    private final HamiltonianRiccatiSolver riccatiSolver = new HamiltonianRiccatiSolver();

    @Test
    void riccatiSolvabilitySwitchesAtTheComputedNorm() {
        Random random = new Random(5L);
        for (int trial = 0; trial < 20; trial++) {
            int n = 2 + random.nextInt(5);
            DMatrixRMaj a = HInfinityNormCalculatorTest.randomHurwitz(n, random);
            DMatrixRMaj b = HInfinityNormCalculatorTest.gaussian(n, 1 + random.nextInt(2), random);
            DMatrixRMaj c = HInfinityNormCalculatorTest.gaussian(1 + random.nextInt(2), n, random);
            double norm = calculator.compute(a, b, c).value();

            DMatrixRMaj q = new DMatrixRMaj(n, n);
            CommonOps_DDRM.multTransA(c, c, q);
            RiccatiSolution above = riccatiSolver.solve(a, quadraticTerm(b, 1.0001 * norm), q);
            assertTrue(above.relativeResidual() < 1e-8);
            assertThrows(
                    NoStabilizingSolutionException.class,
                    () -> riccatiSolver.solve(a, quadraticTerm(b, 0.9999 * norm), q));
        }
    }

    /** B B' / gamma^2, exactly symmetric. */
    private static DMatrixRMaj quadraticTerm(DMatrixRMaj b, double gamma) {
        DMatrixRMaj r = new DMatrixRMaj(b.numRows, b.numRows);
        CommonOps_DDRM.multTransB(b, b, r);
        CommonOps_DDRM.scale(1 / (gamma * gamma), r);
        return r;
    }
}
