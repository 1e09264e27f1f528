package com.loopwright.solver.riccati;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.RealMatrix;

/** Conversions and small matrix helpers shared by the Riccati tests. */
final class RiccatiTestSupport {

    private RiccatiTestSupport() {}

    static RealMatrix toHipparchus(DMatrixRMaj m) {
        double[][] rows = new double[m.numRows][m.numCols];
        for (int i = 0; i < m.numRows; i++) {
            for (int j = 0; j < m.numCols; j++) {
                rows[i][j] = m.get(i, j);
            }
        }
        return new Array2DRowRealMatrix(rows, false);
    }

    static DMatrixRMaj fromHipparchus(RealMatrix m) {
        return new DMatrixRMaj(m.getData());
    }

    static DMatrixRMaj gaussian(int rows, int cols, Random random) {
        DMatrixRMaj m = new DMatrixRMaj(rows, cols);
        for (int i = 0; i < m.getNumElements(); i++) {
            m.data[i] = random.nextGaussian();
        }
        return m;
    }

    /** M M' + shift I: symmetric positive definite for shift > 0. */
    static DMatrixRMaj randomPositiveDefinite(int n, double shift, Random random) {
        DMatrixRMaj m = gaussian(n, n, random);
        DMatrixRMaj spd = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransB(m, m, spd);
        for (int i = 0; i < n; i++) {
            spd.add(i, i, shift);
        }
        return symmetrized(spd);
    }

    static DMatrixRMaj symmetrized(DMatrixRMaj m) {
        DMatrixRMaj s = new DMatrixRMaj(m.numRows, m.numCols);
        CommonOps_DDRM.transpose(m, s);
        CommonOps_DDRM.addEquals(s, m);
        CommonOps_DDRM.scale(0.5, s);
        return s;
    }

    /** X Y X' for a row-major X. */
    static DMatrixRMaj congruence(DMatrixRMaj x, DMatrixRMaj y) {
        DMatrixRMaj xy = new DMatrixRMaj(x.numRows, y.numCols);
        CommonOps_DDRM.mult(x, y, xy);
        DMatrixRMaj result = new DMatrixRMaj(x.numRows, x.numRows);
        CommonOps_DDRM.multTransB(xy, x, result);
        return symmetrized(result);
    }

    static double relativeDifference(DMatrixRMaj actual, DMatrixRMaj expected) {
        DMatrixRMaj difference = actual.copy();
        CommonOps_DDRM.subtractEquals(difference, expected);
        return NormOps_DDRM.normF(difference) / NormOps_DDRM.normF(expected);
    }
}
