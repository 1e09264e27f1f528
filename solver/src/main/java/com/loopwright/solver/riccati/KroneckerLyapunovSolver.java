package com.loopwright.solver.riccati;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Solves the Lyapunov equation {@code F'X + XF = S} for X by writing it as an n^2 x n^2 linear
 * system. The system is nonsingular iff no two eigenvalues of F sum to zero, which holds for a
 * Hurwitz F. Intended for the small n (at most 16, i.e. 256 unknowns) of this package.
 */
final class KroneckerLyapunovSolver {

    private KroneckerLyapunovSolver() {}

    /** Returns X with {@code F'X + XF = S}, or null if the linear system is numerically singular. */
    static DMatrixRMaj solve(DMatrixRMaj f, DMatrixRMaj s) {
        int n = f.numRows;
        int unknowns = n * n;
        // Row (i,j) of the operator: (F'X)_ij + (XF)_ij = sum_k F_ki X_kj + sum_l X_il F_lj.
        DMatrixRMaj operator = new DMatrixRMaj(unknowns, unknowns);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                int row = i * n + j;
                for (int k = 0; k < n; k++) {
                    operator.add(row, k * n + j, f.get(k, i));
                    operator.add(row, i * n + k, f.get(k, j));
                }
            }
        }
        DMatrixRMaj rhs = new DMatrixRMaj(unknowns, 1, true, s.data);
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.lu(unknowns);
        if (!solver.setA(operator)) {
            return null;
        }
        DMatrixRMaj solution = new DMatrixRMaj(unknowns, 1);
        solver.solve(rhs, solution);
        for (int i = 0; i < unknowns; i++) {
            if (!Double.isFinite(solution.data[i])) {
                return null;
            }
        }
        return new DMatrixRMaj(n, n, true, solution.data);
    }
}
