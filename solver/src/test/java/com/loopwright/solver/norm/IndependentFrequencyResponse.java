package com.loopwright.solver.norm;

import org.ejml.data.DMatrixRMaj;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.LUDecomposition;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.SingularValueDecomposition;

/**
 * sigma_max(C (jwI - A)^-1 B) evaluated with Hipparchus only (LU solve of the real form of
 * (jwI - A) X = B, SVD of the real embedding [[Gr, -Gi], [Gi, Gr]]), independent of the EJML
 * code under test.
 */
final class IndependentFrequencyResponse {

    private final RealMatrix a;
    private final RealMatrix b;
    private final RealMatrix c;

    IndependentFrequencyResponse(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        this.a = toHipparchus(a);
        this.b = toHipparchus(b);
        this.c = toHipparchus(c);
    }

    double maxSingularValue(double w) {
        int n = a.getRowDimension();
        int m = b.getColumnDimension();
        int p = c.getRowDimension();
        RealMatrix shifted = new Array2DRowRealMatrix(2 * n, 2 * n);
        RealMatrix minusA = a.scalarMultiply(-1);
        shifted.setSubMatrix(minusA.getData(), 0, 0);
        shifted.setSubMatrix(minusA.getData(), n, n);
        for (int i = 0; i < n; i++) {
            shifted.setEntry(i, n + i, -w);
            shifted.setEntry(n + i, i, w);
        }
        RealMatrix rhs = new Array2DRowRealMatrix(2 * n, m);
        rhs.setSubMatrix(b.getData(), 0, 0);
        RealMatrix x = new LUDecomposition(shifted).getSolver().solve(rhs);
        RealMatrix real = c.multiply(x.getSubMatrix(0, n - 1, 0, m - 1));
        RealMatrix imaginary = c.multiply(x.getSubMatrix(n, 2 * n - 1, 0, m - 1));
        RealMatrix embedding = new Array2DRowRealMatrix(2 * p, 2 * m);
        embedding.setSubMatrix(real.getData(), 0, 0);
        embedding.setSubMatrix(real.getData(), p, m);
        embedding.setSubMatrix(imaginary.getData(), p, 0);
        embedding.setSubMatrix(imaginary.scalarMultiply(-1).getData(), 0, m);
        return new SingularValueDecomposition(embedding).getNorm();
    }

    private static RealMatrix toHipparchus(DMatrixRMaj m) {
        double[][] rows = new double[m.numRows][m.numCols];
        for (int i = 0; i < m.numRows; i++) {
            for (int j = 0; j < m.numCols; j++) {
                rows[i][j] = m.get(i, j);
            }
        }
        return new Array2DRowRealMatrix(rows, false);
    }
}
