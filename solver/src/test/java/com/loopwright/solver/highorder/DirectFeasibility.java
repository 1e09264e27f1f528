package com.loopwright.solver.highorder;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.PoleMatchedSolution;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * A claimed gamma checked by routes that do not use the search: the Hamiltonian (matrix sign function) Riccati
 * solver for Q = diag(rho^2) must return a stabilizing P &gt; 0 whose gain b (row n of P) is the pole-matched gain
 * (alpha_{j-1} - a_{j-1})/b in closed form, and the closed-loop H-infinity norm from w to [rho z; u]
 * (Hamiltonian imaginary-axis eigenvalue test) must not exceed gamma (bounded real lemma, common practice).
 */
final class DirectFeasibility {

    private static final FeasibleGammaSearch SEARCH = new FeasibleGammaSearch();

    private DirectFeasibility() {}

    static void assertFeasible(
            CompanionPlant plant,
            double[] desired,
            FeasibleGammaSearch.FeasibleGammaSet set,
            double gamma,
            String where) {
        int n = plant.order();
        double mu = 1 / (gamma * gamma);
        PoleMatchedSolution solution = SEARCH.solutionAt(plant, desired, set, gamma);
        double[] w = solution.weightsSquared();
        for (double value : w) {
            assertTrue(value >= 0, "rho_i^2 >= 0 at gamma " + gamma + " " + where);
        }
        RiccatiSolution numeric = new HamiltonianRiccatiSolver()
                .solve(
                        plant.stateMatrix(),
                        PoleMatchedRiccati.quadraticTerm(plant, mu),
                        PoleMatchedRiccati.weightMatrix(w));
        DMatrixRMaj p = numeric.p();
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n, false, true);
        assertTrue(eig.decompose(p.copy()));
        for (int i = 0; i < n; i++) {
            assertTrue(eig.getEigenvalue(i).real > 0, "P > 0 at gamma " + gamma + " " + where);
        }
        double[] a = plant.denominator();
        double b = plant.b();
        double[] k = new double[n];
        double kNorm = 0;
        double kError = 0;
        for (int j = 0; j < n; j++) {
            double expected = (desired[j] - a[j]) / b; // pole matching, closed form
            k[j] = b * p.get(n - 1, j);
            kNorm = Math.hypot(kNorm, expected);
            kError = Math.hypot(kError, k[j] - expected);
        }
        assertTrue(kError <= 1e-6 * kNorm, "K reproduced to " + kError / kNorm + " at gamma " + gamma + " " + where);
        DMatrixRMaj closed = plant.stateMatrix();
        DMatrixRMaj performance = new DMatrixRMaj(n + 1, n);
        for (int j = 0; j < n; j++) {
            closed.add(n - 1, j, -b * k[j]);
            performance.set(j, j, Math.sqrt(w[j]));
            performance.set(n, j, -k[j]);
        }
        HInfinityNorm value = new HInfinityNormCalculator().compute(closed, plant.disturbanceInput(), performance);
        assertTrue(value.value() <= gamma * (1 + 1e-8), "norm " + value.value() + " <= gamma " + gamma + " " + where);
    }
}
