package com.loopwright.solver.riccati;

import com.loopwright.solver.design.RiccatiSolution;
import java.util.OptionalDouble;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.SingularOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Stabilizing solution of the algebraic Riccati equation
 * <pre>
 *     A'P + PA + PRP + Q = 0,   A + RP Hurwitz,
 * </pre>
 * with R symmetric and possibly indefinite (H-infinity case {@code R = B1 B1'/gamma^2 - B2 B2'};
 * the LQ case is {@code R = -B Rc^-1 B'}) and Q symmetric (normally positive semidefinite).
 *
 * <p>Method: the stable invariant subspace of the Hamiltonian {@code H = [[A, R], [-Q, -A']]} is
 * spanned by {@code [I; P]}. It is the null space of {@code W + I}, {@code W = sign(H)}, so P solves
 * the consistent overdetermined system {@code [W12; W22 + I] P = -[W11 + I; W21]}, solved by
 * Householder QR least squares and symmetrized. Up to {@value #MAX_REFINEMENT_STEPS} Newton steps on
 * the Riccati equation itself ({@code F'X + XF = -Res(P)}, {@code F = A + RP}) then polish P; a step
 * is kept only if it lowers the relative residual.
 *
 * <p>Stateless and thread-safe.
 */
public final class HamiltonianRiccatiSolver {

    /** Largest accepted state dimension n. */
    public static final int MAX_STATE_DIMENSION = 16;

    /**
     * A solution whose {@link RiccatiResidual#relative relative residual} exceeds this is rejected
     * with {@link NoStabilizingSolutionException} (the problem is then too close to having no
     * stabilizing solution for double precision).
     */
    public static final double MAX_ACCEPTED_RELATIVE_RESIDUAL = 1e-6;

    /**
     * {@code A + RP} counts as Hurwitz only if every eigenvalue has
     * {@code Re(lambda) < -HURWITZ_MARGIN * ||A + RP||_F}: eigenvalues closer to the imaginary axis
     * than this are indistinguishable from it in double precision.
     */
    public static final double HURWITZ_MARGIN = 1e-12;

    /** Newton refinement steps attempted after the sign-function solution. */
    static final int MAX_REFINEMENT_STEPS = 2;

    /** Relative symmetry tolerance for R and Q: |m_ij - m_ji| <= tol * max|m_kl|. */
    private static final double SYMMETRY_TOLERANCE = 1e-10;

    /**
     * [W12; W22 + I] counts as rank deficient (stable subspace not of the form [I; P]) when its
     * smallest singular value is below this times the largest (a few units of roundoff).
     */
    private static final double RANK_TOLERANCE = 1e-14;

    /**
     * Computes the stabilizing solution.
     *
     * @param a state matrix A, n x n, 1 &lt;= n &lt;= {@value #MAX_STATE_DIMENSION}
     * @param r symmetric n x n quadratic-term matrix R (may be indefinite)
     * @param q symmetric n x n constant term Q
     * @return the stabilizing solution with its relative residual
     * @throws IllegalArgumentException for wrong shapes, n out of range, non-finite entries, or
     *     non-symmetric R or Q
     * @throws NoStabilizingSolutionException if no stabilizing solution exists or it cannot be
     *     computed reliably
     */
    public RiccatiSolution solve(DMatrixRMaj a, DMatrixRMaj r, DMatrixRMaj q) {
        int n = RiccatiResidual.requireSquare(a, "A");
        if (n > MAX_STATE_DIMENSION) {
            throw new IllegalArgumentException(
                    "state dimension " + n + " exceeds the supported maximum " + MAX_STATE_DIMENSION);
        }
        RiccatiResidual.requireShape(r, n, "R");
        RiccatiResidual.requireShape(q, n, "Q");
        DMatrixRMaj rSym = symmetricPart(r, "R");
        DMatrixRMaj qSym = symmetricPart(q, "Q");

        // Balance the quadratic and constant terms: with P = s Ps the equation reads
        // A'Ps + Ps A + Ps (s R) Ps + Q/s = 0, and s = sqrt(||Q|| / ||R||) gives both terms the same size,
        // which keeps the Hamiltonian far from numerically singular when ||Q|| and ||R|| differ by decades.
        double scale = balancingScale(rSym, qSym);
        DMatrixRMaj rScaled = rSym.copy();
        DMatrixRMaj qScaled = qSym.copy();
        CommonOps_DDRM.scale(scale, rScaled);
        CommonOps_DDRM.scale(1.0 / scale, qScaled);
        HamiltonianSignIteration.Result sign = HamiltonianSignIteration.compute(hamiltonian(a, rScaled, qScaled));
        DMatrixRMaj p = solutionFromSign(sign.sign(), n);
        CommonOps_DDRM.scale(scale, p);
        requireStabilizing(a, rSym, p, "from the matrix sign function");

        double residual = RiccatiResidual.relative(a, rSym, qSym, p);
        for (int step = 0; step < MAX_REFINEMENT_STEPS && residual > 0.0; step++) {
            DMatrixRMaj refined = newtonStep(a, rSym, qSym, p);
            if (refined == null) {
                break;
            }
            double refinedResidual = RiccatiResidual.relative(a, rSym, qSym, refined);
            if (!(refinedResidual < residual)) {
                break;
            }
            p = refined;
            residual = refinedResidual;
        }
        requireStabilizing(a, rSym, p, "after Newton refinement");

        double reportedResidual = RiccatiResidual.relative(a, r, q, p);
        if (reportedResidual > MAX_ACCEPTED_RELATIVE_RESIDUAL) {
            throw new NoStabilizingSolutionException(
                    "Riccati solution rejected: relative residual " + reportedResidual + " exceeds "
                            + MAX_ACCEPTED_RELATIVE_RESIDUAL
                            + "; the problem is too ill-conditioned (typically too close to the boundary where the stabilizing solution ceases to exist)");
        }
        return new RiccatiSolution(p, reportedResidual, sign.iterations());
    }

    /** sqrt(||Q||_F / ||R||_F), or 1 when either term vanishes (nothing to balance). */
    static double balancingScale(DMatrixRMaj r, DMatrixRMaj q) {
        double rNorm = NormOps_DDRM.normF(r);
        double qNorm = NormOps_DDRM.normF(q);
        if (!(rNorm > 0) || !(qNorm > 0)) {
            return 1.0;
        }
        double scale = Math.sqrt(qNorm / rNorm);
        return Double.isFinite(scale) && scale > 0 ? scale : 1.0;
    }

    /** H = [[A, R], [-Q, -A']]. */
    private static DMatrixRMaj hamiltonian(DMatrixRMaj a, DMatrixRMaj r, DMatrixRMaj q) {
        int n = a.numRows;
        DMatrixRMaj h = new DMatrixRMaj(2 * n, 2 * n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                h.set(i, j, a.get(i, j));
                h.set(i, n + j, r.get(i, j));
                h.set(n + i, j, -q.get(i, j));
                h.set(n + i, n + j, -a.get(j, i));
            }
        }
        return h;
    }

    /** Least-squares solution of [W12; W22 + I] P = -[W11 + I; W21], symmetrized. */
    private static DMatrixRMaj solutionFromSign(DMatrixRMaj w, int n) {
        DMatrixRMaj coefficients = new DMatrixRMaj(2 * n, n);
        DMatrixRMaj rhs = new DMatrixRMaj(2 * n, n);
        for (int i = 0; i < 2 * n; i++) {
            for (int j = 0; j < n; j++) {
                coefficients.set(i, j, w.get(i, n + j) + (i == n + j ? 1.0 : 0.0));
                rhs.set(i, j, -(w.get(i, j) + (i == j ? 1.0 : 0.0)));
            }
        }
        double[] singularValues = SingularOps_DDRM.singularValues(coefficients);
        double largest = 0.0;
        double smallest = Double.POSITIVE_INFINITY;
        for (double s : singularValues) {
            largest = Math.max(largest, s);
            smallest = Math.min(smallest, s);
        }
        if (!(smallest > RANK_TOLERANCE * largest)) {
            throw new NoStabilizingSolutionException(
                    "the stable invariant subspace of the Hamiltonian is not the graph of a matrix P"
                            + " ([W12; W22 + I] is rank deficient, sigma_min/sigma_max = " + smallest / largest
                            + "): typically an unstable mode that R does not reach (not stabilizable)");
        }
        LinearSolverDense<DMatrixRMaj> leastSquares = LinearSolverFactory_DDRM.leastSquares(2 * n, n);
        if (!leastSquares.setA(coefficients)) {
            throw new NoStabilizingSolutionException(
                    "QR factorization of [W12; W22 + I] failed: the stable invariant subspace is not the graph of a matrix P");
        }
        DMatrixRMaj p = new DMatrixRMaj(n, n);
        leastSquares.solve(rhs, p);
        return symmetrize(p);
    }

    /**
     * One Newton step on Res(P) = A'P + PA + PRP + Q: the derivative of Res at P in direction X is
     * F'X + XF with F = A + RP, so X solves F'X + XF = -Res(P). Returns null if the step fails.
     */
    private static DMatrixRMaj newtonStep(DMatrixRMaj a, DMatrixRMaj r, DMatrixRMaj q, DMatrixRMaj p) {
        int n = a.numRows;
        DMatrixRMaj closedLoop = closedLoop(a, r, p);
        DMatrixRMaj residual = new DMatrixRMaj(n, n);
        DMatrixRMaj product = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransA(a, p, residual);
        CommonOps_DDRM.multAdd(p, a, residual);
        CommonOps_DDRM.mult(r, p, product);
        CommonOps_DDRM.multAdd(p, product, residual);
        CommonOps_DDRM.addEquals(residual, q);
        CommonOps_DDRM.scale(-1.0, residual);
        DMatrixRMaj correction = KroneckerLyapunovSolver.solve(closedLoop, residual);
        if (correction == null) {
            return null;
        }
        DMatrixRMaj refined = p.copy();
        CommonOps_DDRM.addEquals(refined, correction);
        return symmetrize(refined);
    }

    private static void requireStabilizing(DMatrixRMaj a, DMatrixRMaj r, DMatrixRMaj p, String stage) {
        for (int i = 0; i < p.getNumElements(); i++) {
            if (!Double.isFinite(p.data[i])) {
                throw new NoStabilizingSolutionException("Riccati solution " + stage
                        + " has non-finite entries: no stabilizing solution could be computed");
            }
        }
        DMatrixRMaj closedLoop = closedLoop(a, r, p);
        OptionalDouble abscissa = SpectralAbscissa.of(closedLoop);
        if (abscissa.isEmpty()) {
            throw new NoStabilizingSolutionException("eigenvalue computation of A + RP failed " + stage
                    + ": stability of the solution cannot be verified");
        }
        double margin = HURWITZ_MARGIN * NormOps_DDRM.normF(closedLoop);
        if (!(abscissa.getAsDouble() < -margin)) {
            throw new NoStabilizingSolutionException(
                    "Riccati solution " + stage + " is not stabilizing: A + RP has an eigenvalue with real part "
                            + abscissa.getAsDouble()
                            + " (required < " + (-margin) + "); no stabilizing solution exists"
                            + " (unstabilizable mode, or eigenvalues of the Hamiltonian on the imaginary axis)");
        }
    }

    /** F = A + RP. */
    private static DMatrixRMaj closedLoop(DMatrixRMaj a, DMatrixRMaj r, DMatrixRMaj p) {
        DMatrixRMaj f = a.copy();
        CommonOps_DDRM.multAdd(r, p, f);
        return f;
    }

    private static DMatrixRMaj symmetricPart(DMatrixRMaj m, String name) {
        int n = m.numRows;
        double maxAbs = CommonOps_DDRM.elementMaxAbs(m);
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (Math.abs(m.get(i, j) - m.get(j, i)) > SYMMETRY_TOLERANCE * maxAbs) {
                    throw new IllegalArgumentException(name + " must be symmetric: entries (" + i + ", " + j + ") and ("
                            + j + ", " + i + ") differ by " + Math.abs(m.get(i, j) - m.get(j, i)));
                }
            }
        }
        return symmetrize(m.copy());
    }

    /** In place M <- (M + M') / 2; returns M. */
    private static DMatrixRMaj symmetrize(DMatrixRMaj m) {
        int n = m.numRows;
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                double mean = 0.5 * (m.get(i, j) + m.get(j, i));
                m.set(i, j, mean);
                m.set(j, i, mean);
            }
        }
        return m;
    }
}
