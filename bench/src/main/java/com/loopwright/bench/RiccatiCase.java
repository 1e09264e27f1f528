package com.loopwright.bench;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.RealMatrix;

/**
 * One seeded LQ Riccati problem A'P + PA - P B Rc^-1 B' P + Q = 0 of order n, in both libraries' forms:
 * Hipparchus takes (A, B, Q, Rc); ours takes (A, R, Q) with R = -B Rc^-1 B'. A, B and C are Gaussian, Q = C'C
 * with C square, Rc = I; with these the pair (A, B) is stabilizable with probability one.
 *
 * @param a state matrix, n x n
 * @param b input matrix, n x m with m = max(1, n / 2)
 * @param q constant term C'C, n x n
 * @param r our quadratic term -B B', n x n
 * @param controlWeight Rc = I, m x m
 */
public record RiccatiCase(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj q, DMatrixRMaj r, DMatrixRMaj controlWeight) {

    /** The seed every run uses, so all runs solve the same equations. */
    public static final long SEED = 20261202L;

    public RiccatiCase {
        a = a.copy();
        b = b.copy();
        q = q.copy();
        r = r.copy();
        controlWeight = controlWeight.copy();
    }

    @Override
    public DMatrixRMaj a() {
        return a.copy();
    }

    @Override
    public DMatrixRMaj b() {
        return b.copy();
    }

    @Override
    public DMatrixRMaj q() {
        return q.copy();
    }

    @Override
    public DMatrixRMaj r() {
        return r.copy();
    }

    @Override
    public DMatrixRMaj controlWeight() {
        return controlWeight.copy();
    }

    public static RiccatiCase ofOrder(int n) {
        Random random = new Random(SEED + n);
        int m = Math.max(1, n / 2);
        DMatrixRMaj a = gaussian(n, n, random);
        DMatrixRMaj b = gaussian(n, m, random);
        DMatrixRMaj c = gaussian(n, n, random);
        DMatrixRMaj q = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransA(c, c, q);
        symmetrize(q);
        DMatrixRMaj r = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransB(-1.0, b, b, r);
        symmetrize(r);
        return new RiccatiCase(a, b, q, r, CommonOps_DDRM.identity(m));
    }

    public static RealMatrix toHipparchus(DMatrixRMaj m) {
        double[][] rows = new double[m.numRows][m.numCols];
        for (int i = 0; i < m.numRows; i++) {
            for (int j = 0; j < m.numCols; j++) {
                rows[i][j] = m.get(i, j);
            }
        }
        return new Array2DRowRealMatrix(rows, false);
    }

    public static DMatrixRMaj fromHipparchus(RealMatrix m) {
        return new DMatrixRMaj(m.getData());
    }

    private static DMatrixRMaj gaussian(int rows, int cols, Random random) {
        DMatrixRMaj m = new DMatrixRMaj(rows, cols);
        for (int i = 0; i < m.getNumElements(); i++) {
            m.data[i] = random.nextGaussian();
        }
        return m;
    }

    private static void symmetrize(DMatrixRMaj m) {
        for (int i = 0; i < m.numRows; i++) {
            for (int j = i + 1; j < m.numCols; j++) {
                double mean = 0.5 * (m.get(i, j) + m.get(j, i));
                m.set(i, j, mean);
                m.set(j, i, mean);
            }
        }
    }
}
