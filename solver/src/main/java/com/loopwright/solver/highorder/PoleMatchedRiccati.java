package com.loopwright.solver.highorder;

import com.loopwright.solver.design.PoleMatchedSolution;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.RiccatiResidual;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.SingularOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * The Riccati equation A'P + PA + PRP + Q = 0, R = B1B1'/gamma^2 - B2B2', Q = diag(rho_1^2 .. rho_n^2), with the
 * last column of P fixed by pole matching. With B2 = b e_n the closed loop A - B2B2'P has last row
 * -a_j - b^2 p_{n,j}, so matching s^n + alpha_{n-1} s^{n-1} + ... + alpha_0 gives
 * <pre>
 *   p_{j,n} = (alpha_{j-1} - a_{j-1}) / b^2,   j = 1..n.
 * </pre>
 * P B2B2' P = b^2 (P e_n)(P e_n)' then involves only that column. The unknowns are the n(n-1)/2 entries of the
 * leading (n-1) x (n-1) block of P and the n weights rho_i^2, as many as the n(n+1)/2 distinct equations. When
 * B1 is a multiple of e_n the equation is linear in them and one solve is exact; otherwise the term
 * P B1B1' P / gamma^2 makes it quadratic and Newton steps on the same Jacobian finish it.
 */
public final class PoleMatchedRiccati {

    /** Newton steps after the first solve (none are needed when the disturbance is matched). */
    public static final int MAX_NEWTON_STEPS = 30;
    /** The linear system counts as singular below this reciprocal condition number (after column scaling). */
    public static final double MIN_RECIPROCAL_CONDITION = 1e-14;
    /** Newton stops once the relative Riccati residual is below this. */
    static final double TARGET_RESIDUAL = 1e-15;

    /** Thrown when the linear system is singular or Newton does not converge. */
    public static final class SystemFailure extends RuntimeException {
        public SystemFailure(String message) {
            super(message);
        }
    }

    /** The last column of P for a desired polynomial: p_{j,n} = (alpha_{j-1} - a_{j-1})/b^2. */
    public static double[] matchedColumn(CompanionPlant plant, double[] desired) {
        double[] a = plant.denominator();
        double b2 = plant.b() * plant.b();
        double[] column = new double[a.length];
        for (int j = 0; j < a.length; j++) {
            column[j] = (desired[j] - a[j]) / b2;
        }
        return column;
    }

    /** R = B1B1'/gamma^2 - B2B2'. */
    public static DMatrixRMaj quadraticTerm(CompanionPlant plant, double inverseGammaSquared) {
        int n = plant.order();
        double[] d = plant.disturbance();
        DMatrixRMaj r = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                r.set(i, j, d[i] * d[j] * inverseGammaSquared);
            }
        }
        r.set(n - 1, n - 1, r.get(n - 1, n - 1) - plant.b() * plant.b());
        return r;
    }

    /** Q = diag(rho^2). */
    public static DMatrixRMaj weightMatrix(double[] weightsSquared) {
        DMatrixRMaj q = new DMatrixRMaj(weightsSquared.length, weightsSquared.length);
        for (int i = 0; i < weightsSquared.length; i++) {
            q.set(i, i, weightsSquared[i]);
        }
        return q;
    }

    /**
     * Solves for P and the weights at 1/gamma^2 = inverseGammaSquared (0 means gamma = infinity).
     *
     * @throws SystemFailure when the system is singular or Newton does not reach the residual
     */
    public PoleMatchedSolution solve(CompanionPlant plant, double[] desired, double inverseGammaSquared) {
        return solve(plant, desired, inverseGammaSquared, true);
    }

    /** As {@link #solve(CompanionPlant, double[], double)}; the singular-value condition check is optional. */
    PoleMatchedSolution solve(
            CompanionPlant plant, double[] desired, double inverseGammaSquared, boolean checkCondition) {
        int n = plant.order();
        return newton(
                plant,
                desired,
                inverseGammaSquared,
                new DMatrixRMaj(n, n),
                new double[n],
                checkCondition,
                checkCondition);
    }

    /**
     * Newton from a given start (a neighbouring solution when a branch is followed in 1/gamma^2); the last
     * column of the start's P is replaced by the pole-matched one.
     *
     * @throws SystemFailure when the Jacobian is singular or Newton does not reach the residual
     */
    public PoleMatchedSolution solveFrom(
            CompanionPlant plant, double[] desired, double inverseGammaSquared, PoleMatchedSolution start) {
        return newton(plant, desired, inverseGammaSquared, start.p(), start.weightsSquared(), false, false);
    }

    /** As {@link #solveFrom} and reports the reciprocal condition of the first Jacobian (one SVD more). */
    public PoleMatchedSolution solveFromWithCondition(
            CompanionPlant plant, double[] desired, double inverseGammaSquared, PoleMatchedSolution start) {
        return newton(plant, desired, inverseGammaSquared, start.p(), start.weightsSquared(), true, false);
    }

    private PoleMatchedSolution newton(
            CompanionPlant plant,
            double[] desired,
            double inverseGammaSquared,
            DMatrixRMaj start,
            double[] startWeights,
            boolean computeCondition,
            boolean checkCondition) {
        int n = plant.order();
        int free = n * (n - 1) / 2;
        int unknowns = free + n;
        DMatrixRMaj a = plant.stateMatrix();
        DMatrixRMaj r = quadraticTerm(plant, inverseGammaSquared);
        double[] column = matchedColumn(plant, desired);
        DMatrixRMaj p = start.copy();
        for (int j = 0; j < n; j++) {
            p.set(j, n - 1, column[j]);
            p.set(n - 1, j, column[j]);
        }
        double[] weights = startWeights.clone();
        double reciprocalCondition = Double.NaN;
        int steps = 0;
        double residual = Double.POSITIVE_INFINITY;
        for (int iteration = 0; iteration <= MAX_NEWTON_STEPS; iteration++) {
            DMatrixRMaj jacobian = new DMatrixRMaj(unknowns, unknowns);
            DMatrixRMaj worstCase = a.copy();
            CommonOps_DDRM.multAdd(r, p, worstCase);
            int col = 0;
            for (int i = 0; i < n - 1; i++) {
                for (int j = i; j < n - 1; j++) {
                    putUpper(jacobian, col++, derivative(worstCase, i, j));
                }
            }
            for (int i = 0; i < n; i++) {
                DMatrixRMaj e = new DMatrixRMaj(n, n);
                e.set(i, i, 1);
                putUpper(jacobian, col++, e);
            }
            DMatrixRMaj f = riccati(a, r, p, weightMatrix(weights));
            DMatrixRMaj rhs = new DMatrixRMaj(unknowns, 1);
            putUpper(rhs, 0, f);
            // Column scaling: unknowns of very different size (entries of P vs weights) get unit columns.
            double[] scale = new double[unknowns];
            for (int c = 0; c < unknowns; c++) {
                double largest = 0;
                for (int k = 0; k < unknowns; k++) {
                    largest = Math.max(largest, Math.abs(jacobian.get(k, c)));
                }
                double sum = 0;
                for (int k = 0; k < unknowns && largest > 0; k++) {
                    double v = jacobian.get(k, c) / largest;
                    sum += v * v;
                }
                double norm = largest * Math.sqrt(sum);
                scale[c] = norm > 0 ? norm : 1;
                for (int k = 0; k < unknowns; k++) {
                    jacobian.set(k, c, jacobian.get(k, c) / scale[c]);
                }
            }
            if (iteration == 0 && computeCondition) {
                reciprocalCondition = reciprocalCondition(jacobian);
                if (checkCondition && !(reciprocalCondition >= MIN_RECIPROCAL_CONDITION)) {
                    throw new SystemFailure("the pole-matched Riccati system is singular (reciprocal condition "
                            + reciprocalCondition + ")");
                }
            }
            LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(unknowns);
            if (!lu.setA(jacobian)) {
                throw new SystemFailure("the pole-matched Riccati system could not be factored");
            }
            DMatrixRMaj step = new DMatrixRMaj(unknowns, 1);
            lu.solve(rhs, step);
            DMatrixRMaj trialP = p.copy();
            double[] trialWeights = weights.clone();
            col = 0;
            for (int i = 0; i < n - 1; i++) {
                for (int j = i; j < n - 1; j++) {
                    double value = trialP.get(i, j) - step.get(col) / scale[col];
                    col++;
                    trialP.set(i, j, value);
                    trialP.set(j, i, value);
                }
            }
            for (int i = 0; i < n; i++) {
                trialWeights[i] -= step.get(col) / scale[col];
                col++;
            }
            double trialResidual = RiccatiResidual.relative(a, r, weightMatrix(trialWeights), trialP);
            if (!(trialResidual < residual)) {
                break;
            }
            p = trialP;
            weights = trialWeights;
            residual = trialResidual;
            steps = iteration;
            if (residual <= TARGET_RESIDUAL) {
                break;
            }
        }
        if (!(residual <= MAX_ACCEPTED_RESIDUAL)) {
            throw new SystemFailure(
                    "Newton on the pole-matched Riccati system stalled at relative residual " + residual);
        }
        return new PoleMatchedSolution(p, weights, residual, reciprocalCondition, steps);
    }

    /** Solutions with a larger relative residual are rejected. */
    public static final double MAX_ACCEPTED_RESIDUAL = 1e-10;

    /**
     * Derivative of A'P + PA + PRP in the direction E = e_i e_j' + e_j e_i' (E = e_i e_i' when i = j): with
     * F = A + RP it is F'E + EF = G + G', G = F'E, whose column j is row i of F and column i is row j of F.
     */
    private static DMatrixRMaj derivative(DMatrixRMaj worstCase, int i, int j) {
        int n = worstCase.numRows;
        DMatrixRMaj g = new DMatrixRMaj(n, n);
        for (int k = 0; k < n; k++) {
            g.add(k, j, worstCase.get(i, k));
            if (i != j) {
                g.add(k, i, worstCase.get(j, k));
            }
        }
        DMatrixRMaj out = new DMatrixRMaj(n, n);
        CommonOps_DDRM.transpose(g, out);
        CommonOps_DDRM.addEquals(out, g);
        return out;
    }

    /** A'P + PA + PRP + Q. */
    static DMatrixRMaj riccati(DMatrixRMaj a, DMatrixRMaj r, DMatrixRMaj p, DMatrixRMaj q) {
        int n = a.numRows;
        DMatrixRMaj out = q.copy();
        CommonOps_DDRM.multAddTransA(a, p, out);
        CommonOps_DDRM.multAdd(p, a, out);
        DMatrixRMaj rp = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(r, p, rp);
        CommonOps_DDRM.multAdd(p, rp, out);
        return out;
    }

    /** Writes the upper triangle (i &lt;= j) of a symmetric n x n matrix into column col of target. */
    private static void putUpper(DMatrixRMaj target, int col, DMatrixRMaj m) {
        int row = 0;
        for (int i = 0; i < m.numRows; i++) {
            for (int j = i; j < m.numCols; j++) {
                target.set(row++, col, m.get(i, j));
            }
        }
    }

    private static double reciprocalCondition(DMatrixRMaj m) {
        double[] s = SingularOps_DDRM.singularValues(m);
        double max = 0;
        double min = Double.POSITIVE_INFINITY;
        for (double v : s) {
            max = Math.max(max, v);
            min = Math.min(min, v);
        }
        return max > 0 ? min / max : 0;
    }

    static double frobenius(DMatrixRMaj m) {
        return NormOps_DDRM.normF(m);
    }
}
