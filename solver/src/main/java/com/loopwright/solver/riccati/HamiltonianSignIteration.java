package com.loopwright.solver.riccati;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.decomposition.lu.LUDecompositionAlt_DDRM;
import org.ejml.dense.row.linsol.lu.LinearSolverLu_DDRM;

/**
 * Matrix sign function of a 2n x 2n Hamiltonian matrix by the determinant-scaled Newton iteration
 * {@code Z <- (c Z + (c Z)^-1) / 2}, {@code c = |det Z|^(-1/(2n))}, started at {@code Z = H}.
 *
 * <p>sign(H) has eigenvalue -1 on the stable and +1 on the anti-stable invariant subspace of H; it
 * exists only if H has no eigenvalue on the imaginary axis. Each iterate of a Hamiltonian matrix is
 * Hamiltonian (inverses and sums of Hamiltonian matrices are), so that structure is restored after
 * every step to keep rounding errors from accumulating outside it.
 */
final class HamiltonianSignIteration {

    /** Hard cap on Newton steps; scaled Newton typically needs 6-15. */
    static final int MAX_ITERATIONS = 100;

    /** Declare convergence once the relative change ||Z_k+1 - Z_k||_1 / ||Z_k+1||_1 is below this. */
    private static final double CONVERGED_RELATIVE_CHANGE = 1e-13;

    /**
     * In the quadratic phase (change below this), a step that fails to halve the change means the
     * iteration has reached its rounding floor: accept the current iterate.
     */
    private static final double STAGNATION_ONSET = 1e-8;

    /** Determinant scaling only helps far from convergence; switch it off below this change. */
    private static final double SCALING_OFF_BELOW = 1e-2;

    /** Reciprocal 1-norm condition number of an iterate below which it counts as singular. */
    private static final double MIN_RECIPROCAL_CONDITION = 1e-15;

    record Result(DMatrixRMaj sign, int iterations) {}

    private HamiltonianSignIteration() {}

    static Result compute(DMatrixRMaj hamiltonian) {
        int dim = hamiltonian.numRows;
        DMatrixRMaj z = hamiltonian.copy();
        DMatrixRMaj zInverse = new DMatrixRMaj(dim, dim);
        DMatrixRMaj next = new DMatrixRMaj(dim, dim);
        double previousChange = Double.POSITIVE_INFINITY;
        boolean scaling = true;

        for (int iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
            LUDecompositionAlt_DDRM lu = new LUDecompositionAlt_DDRM();
            LinearSolverLu_DDRM solver = new LinearSolverLu_DDRM(lu);
            solver.setA(z);
            // log|det Z| = sum of log|u_ii| over the diagonal of the LU factor (avoids overflow).
            double logAbsDet = 0.0;
            DMatrixRMaj factor = lu.getLU();
            for (int i = 0; i < dim; i++) {
                double pivot = Math.abs(factor.get(i, i));
                if (pivot == 0.0) {
                    throw singular(iteration);
                }
                logAbsDet += Math.log(pivot);
            }
            solver.invert(zInverse);
            double zNorm = NormOps_DDRM.inducedP1(z);
            double inverseNorm = NormOps_DDRM.inducedP1(zInverse);
            if (!Double.isFinite(inverseNorm) || 1.0 / (zNorm * inverseNorm) < MIN_RECIPROCAL_CONDITION) {
                throw singular(iteration);
            }

            double c = scaling ? Math.exp(-logAbsDet / dim) : 1.0;
            for (int i = 0; i < dim * dim; i++) {
                next.data[i] = 0.5 * (c * z.data[i] + zInverse.data[i] / c);
            }
            restoreHamiltonianStructure(next);

            double change = relativeChange(next, z);
            DMatrixRMaj swap = z;
            z = next;
            next = swap;
            if (!Double.isFinite(change)) {
                throw new NoStabilizingSolutionException(
                        "matrix sign iteration of the Hamiltonian diverged at step " + iteration
                                + ": the Riccati data are too badly scaled or the Hamiltonian has eigenvalues near the imaginary axis");
            }
            if (change <= CONVERGED_RELATIVE_CHANGE
                    || (previousChange <= STAGNATION_ONSET && change > 0.5 * previousChange)) {
                return new Result(z, iteration);
            }
            if (change < SCALING_OFF_BELOW) {
                scaling = false;
            }
            previousChange = change;
        }
        throw new NoStabilizingSolutionException(
                "matrix sign iteration of the Hamiltonian did not converge in " + MAX_ITERATIONS
                        + " steps (last relative change " + previousChange
                        + "): the Hamiltonian has eigenvalues on or too close to the imaginary axis, so there is no stabilizing solution"
                        + " (in H-infinity terms: gamma is at or below the achievable level)");
    }

    private static NoStabilizingSolutionException singular(int iteration) {
        return new NoStabilizingSolutionException(
                "matrix sign iterate " + iteration + " of the Hamiltonian is numerically singular:"
                        + " the Hamiltonian has an eigenvalue at or near the imaginary axis, so there is no stabilizing solution");
    }

    /**
     * Projects Z = [[Z11, Z12], [Z21, Z22]] onto the Hamiltonian matrices:
     * Z12 and Z21 symmetric, Z22 = -Z11'.
     */
    private static void restoreHamiltonianStructure(DMatrixRMaj z) {
        int n = z.numRows / 2;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double z11 = 0.5 * (z.get(i, j) - z.get(n + j, n + i));
                z.set(i, j, z11);
                z.set(n + j, n + i, -z11);
            }
            for (int j = i + 1; j < n; j++) {
                double z12 = 0.5 * (z.get(i, n + j) + z.get(j, n + i));
                z.set(i, n + j, z12);
                z.set(j, n + i, z12);
                double z21 = 0.5 * (z.get(n + i, j) + z.get(n + j, i));
                z.set(n + i, j, z21);
                z.set(n + j, i, z21);
            }
        }
    }

    /** ||next - current||_1 / ||next||_1 (induced 1-norm). */
    private static double relativeChange(DMatrixRMaj next, DMatrixRMaj current) {
        int dim = next.numRows;
        double maxColumnDifference = 0.0;
        double maxColumnNext = 0.0;
        for (int j = 0; j < dim; j++) {
            double difference = 0.0;
            double column = 0.0;
            for (int i = 0; i < dim; i++) {
                difference += Math.abs(next.get(i, j) - current.get(i, j));
                column += Math.abs(next.get(i, j));
            }
            maxColumnDifference = Math.max(maxColumnDifference, difference);
            maxColumnNext = Math.max(maxColumnNext, column);
        }
        return maxColumnDifference / maxColumnNext;
    }
}
