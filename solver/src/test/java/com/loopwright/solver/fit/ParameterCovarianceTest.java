package com.loopwright.solver.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.LUDecomposition;
import org.hipparchus.linear.RealMatrix;
import org.junit.jupiter.api.Test;

/** Standard errors from the scaled SVD against the textbook normal-equation inverse s^2 (J'J)^-1. */
class ParameterCovarianceTest {

    @Test
    void aWellConditionedJacobianGivesTheNormalEquationStandardErrors() {
        Random random = new Random(1);
        double[][] j = new double[30][3];
        for (double[] row : j) {
            row[0] = 1;
            row[1] = 1e3 * random.nextGaussian();
            row[2] = 1e-3 * random.nextGaussian();
        }
        RealMatrix jacobian = new Array2DRowRealMatrix(j);
        double s2 = 0.04;
        // source: textbook least squares, Cov = s^2 (J'J)^-1, inverted by LU (reference library).
        RealMatrix covariance = new LUDecomposition(jacobian.transposeMultiply(jacobian))
                .getSolver()
                .getInverse()
                .scalarMultiply(s2);
        double[] errors = ParameterCovariance.standardErrors(jacobian, s2);
        for (int i = 0; i < 3; i++) {
            double expected = Math.sqrt(covariance.getEntry(i, i));
            assertEquals(expected, errors[i], 1e-9 * expected);
        }
    }

    @Test
    void aSingularJacobianLeavesItsDirectionWithoutAStandardError() {
        Random random = new Random(2);
        double[][] j = new double[30][3];
        for (double[] row : j) {
            row[0] = random.nextGaussian();
            row[1] = random.nextGaussian();
            row[2] = 2 * row[1] * (1 + 1e-12 * random.nextGaussian());
        }
        double[] errors = ParameterCovariance.standardErrors(new Array2DRowRealMatrix(j), 1);
        assertTrue(errors[0] > 0 && Double.isFinite(errors[0]), "the independent column is determined");
        assertTrue(Double.isNaN(errors[1]) && Double.isNaN(errors[2]), errors[1] + " " + errors[2]);
        // An all-zero column: the parameter does not act on the model at all.
        for (double[] row : j) {
            row[2] = 0;
        }
        errors = ParameterCovariance.standardErrors(new Array2DRowRealMatrix(j), 1);
        assertTrue(Double.isFinite(errors[1]) && Double.isNaN(errors[2]));
    }
}
