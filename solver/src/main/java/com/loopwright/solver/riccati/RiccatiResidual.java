package com.loopwright.solver.riccati;

import java.util.Objects;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;

/** Relative residual of a candidate solution of {@code A'P + PA + PRP + Q = 0}. */
public final class RiccatiResidual {

    private RiccatiResidual() {}

    /**
     * Relative residual
     * {@code ||A'P + PA + PRP + Q||_F / (||A'P||_F + ||PA||_F + ||PRP||_F + ||Q||_F)},
     * or 0 when the denominator is 0. By the triangle inequality the value lies in [0, 1] (up to rounding).
     *
     * @throws IllegalArgumentException if the matrices are not all n x n, contain non-finite
     *     entries, or the products overflow
     */
    public static double relative(DMatrixRMaj a, DMatrixRMaj r, DMatrixRMaj q, DMatrixRMaj p) {
        int n = requireSquare(a, "A");
        requireShape(r, n, "R");
        requireShape(q, n, "Q");
        requireShape(p, n, "P");

        DMatrixRMaj transAP = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransA(a, p, transAP);
        DMatrixRMaj pa = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(p, a, pa);
        DMatrixRMaj rp = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(r, p, rp);
        DMatrixRMaj prp = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(p, rp, prp);

        DMatrixRMaj sum = new DMatrixRMaj(n, n);
        double[] s = sum.data;
        for (int i = 0; i < n * n; i++) {
            s[i] = transAP.data[i] + pa.data[i] + prp.data[i] + q.data[i];
        }
        double numerator = NormOps_DDRM.normF(sum);
        double denominator =
                NormOps_DDRM.normF(transAP) + NormOps_DDRM.normF(pa) + NormOps_DDRM.normF(prp) + NormOps_DDRM.normF(q);
        if (!Double.isFinite(numerator) || !Double.isFinite(denominator)) {
            throw new IllegalArgumentException(
                    "Riccati residual overflowed: entries of A, R, Q or P are too large to evaluate in double precision");
        }
        return denominator == 0.0 ? 0.0 : numerator / denominator;
    }

    static int requireSquare(DMatrixRMaj m, String name) {
        Objects.requireNonNull(m, name);
        if (m.numRows != m.numCols || m.numRows == 0) {
            throw new IllegalArgumentException(
                    name + " must be square and non-empty, got " + m.numRows + "x" + m.numCols);
        }
        requireFinite(m, name);
        return m.numRows;
    }

    static void requireShape(DMatrixRMaj m, int n, String name) {
        Objects.requireNonNull(m, name);
        if (m.numRows != n || m.numCols != n) {
            throw new IllegalArgumentException(
                    name + " must be " + n + "x" + n + ", got " + m.numRows + "x" + m.numCols);
        }
        requireFinite(m, name);
    }

    private static void requireFinite(DMatrixRMaj m, String name) {
        int size = m.getNumElements();
        for (int i = 0; i < size; i++) {
            if (!Double.isFinite(m.data[i])) {
                throw new IllegalArgumentException(
                        name + " has a non-finite entry at (" + i / m.numCols + ", " + i % m.numCols + ")");
            }
        }
    }
}
