package com.loopwright.solver.highorder;

import com.loopwright.solver.plant.CompanionPlant;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.SingularOps_DDRM;

/**
 * A controllable state space x' = A x + B2 u + B1 w, y = C x brought to companion form by x = T z.
 * With Wx = [B2, A B2, ..., A^{n-1} B2] and Wz the same for the companion pair (Ac, e_n), T = Wx Wz^-1; the
 * characteristic polynomial comes from Cayley-Hamilton, A^n B2 = -sum a_i A^i B2, i.e. a = -Wx^-1 A^n B2.
 * Then Ac = T^-1 A T, e_n = T^-1 B2 (so b = 1), B1z = T^-1 B1, cz = C T.
 */
public final class CompanionTransform {

    /** Below this reciprocal condition of Wx the pair (A, B2) counts as uncontrollable. */
    public static final double MIN_RECIPROCAL_CONDITION = 1e-12;

    /**
     * The plant in companion coordinates and the change of coordinates.
     *
     * @param plant                the companion plant (b = 1)
     * @param toPlant              T, x = T z
     * @param toCompanion          T^-1, z = T^-1 x
     * @param reciprocalCondition  sigma_min/sigma_max of the controllability matrix Wx
     */
    public record Result(
            CompanionPlant plant, DMatrixRMaj toPlant, DMatrixRMaj toCompanion, double reciprocalCondition) {
        public Result {
            toPlant = toPlant.copy();
            toCompanion = toCompanion.copy();
        }

        @Override
        public DMatrixRMaj toPlant() {
            return toPlant.copy();
        }

        @Override
        public DMatrixRMaj toCompanion() {
            return toCompanion.copy();
        }
    }

    /** Thrown when (A, B2) is not controllable within double precision. */
    public static final class UncontrollableException extends RuntimeException {
        public UncontrollableException(String message) {
            super(message);
        }
    }

    public Result transform(DMatrixRMaj a, DMatrixRMaj b2, DMatrixRMaj b1, DMatrixRMaj output) {
        int n = a.numRows;
        DMatrixRMaj wx = controllability(a, b2);
        double rcond = reciprocalCondition(wx);
        if (!(rcond >= MIN_RECIPROCAL_CONDITION)) {
            throw new UncontrollableException(String.format(
                    "the state space is not controllable from u: the"
                            + " controllability matrix [B2, A B2, ...] has reciprocal condition %.3g (needs at least %.0e)",
                    rcond, MIN_RECIPROCAL_CONDITION));
        }
        DMatrixRMaj wxInverse = wx.copy();
        if (!CommonOps_DDRM.invert(wxInverse)) {
            throw new UncontrollableException("the controllability matrix could not be inverted");
        }
        DMatrixRMaj power = b2.copy();
        for (int i = 0; i < n; i++) {
            DMatrixRMaj next = new DMatrixRMaj(n, 1);
            CommonOps_DDRM.mult(a, power, next);
            power = next;
        }
        DMatrixRMaj coefficients = new DMatrixRMaj(n, 1);
        CommonOps_DDRM.mult(wxInverse, power, coefficients);
        double[] denominator = new double[n];
        for (int i = 0; i < n; i++) {
            denominator[i] = -coefficients.get(i, 0);
        }
        double[] unitB1 = new double[n];
        unitB1[n - 1] = 1;
        CompanionPlant probe = new CompanionPlant(denominator, unitRow(n), 1, unitB1);
        DMatrixRMaj wz = controllability(probe.stateMatrix(), probe.controlInput());
        DMatrixRMaj wzInverse = wz.copy();
        if (!CommonOps_DDRM.invert(wzInverse)) {
            throw new UncontrollableException("the companion controllability matrix could not be inverted");
        }
        DMatrixRMaj t = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(wx, wzInverse, t);
        DMatrixRMaj tInverse = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(wz, wxInverse, tInverse);
        DMatrixRMaj b1z = new DMatrixRMaj(n, 1);
        CommonOps_DDRM.mult(tInverse, b1, b1z);
        DMatrixRMaj cz = new DMatrixRMaj(1, n);
        CommonOps_DDRM.mult(output, t, cz);
        return new Result(new CompanionPlant(denominator, cz.data.clone(), 1, b1z.data.clone()), t, tInverse, rcond);
    }

    private static DMatrixRMaj controllability(DMatrixRMaj a, DMatrixRMaj b) {
        int n = a.numRows;
        DMatrixRMaj w = new DMatrixRMaj(n, n);
        DMatrixRMaj column = b.copy();
        for (int j = 0; j < n; j++) {
            for (int i = 0; i < n; i++) {
                w.set(i, j, column.get(i, 0));
            }
            DMatrixRMaj next = new DMatrixRMaj(n, 1);
            CommonOps_DDRM.mult(a, column, next);
            column = next;
        }
        return w;
    }

    private static double[] unitRow(int n) {
        double[] c = new double[n];
        c[0] = 1;
        return c;
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
}
