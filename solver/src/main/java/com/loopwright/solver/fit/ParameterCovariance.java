package com.loopwright.solver.fit;

import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.SingularValueDecomposition;

/**
 * Standard errors of least-squares estimates from the Jacobian J at the optimum. Cov = s^2 (J'J)^-1 is formed
 * as s^2 D^-1 V S^-2 V' D^-1 from the singular value decomposition J D^-1 = U S V' of the column-scaled
 * Jacobian (D = column norms), so a variance is a sum of squares and never negative, whatever the rounding.
 *
 * <p>A direction whose scaled singular value is below {@link #NEAR_SINGULAR} times the largest is one the data
 * do not determine (J'J is singular to working precision there: its condition number exceeds 10^12, and the
 * central-difference column of the damping ratio carries errors near 10^-10). A parameter whose variance
 * would come mostly from such directions has no standard error: it is reported as NaN, for the caller to omit.
 */
final class ParameterCovariance {

    /** Relative singular value of the scaled Jacobian below which a direction is not determined. */
    static final double NEAR_SINGULAR = 1e-6;
    /** Share of a variance from undetermined directions above which the standard error is not reported. */
    static final double UNDETERMINED_SHARE = 0.5;

    private ParameterCovariance() {}

    /**
     * @param jacobian         n x p Jacobian of the model at the optimum
     * @param residualVariance s^2 = SSR / (n - p)
     * @return the p standard errors; NaN for a parameter the data do not determine
     */
    static double[] standardErrors(RealMatrix jacobian, double residualVariance) {
        int n = jacobian.getRowDimension();
        int p = jacobian.getColumnDimension();
        double[] scale = new double[p];
        RealMatrix scaled = jacobian.copy();
        for (int j = 0; j < p; j++) {
            scale[j] = jacobian.getColumnVector(j).getNorm();
            for (int i = 0; i < n && scale[j] > 0; i++) {
                scaled.setEntry(i, j, jacobian.getEntry(i, j) / scale[j]);
            }
        }
        SingularValueDecomposition svd = new SingularValueDecomposition(scaled);
        double[] singular = svd.getSingularValues();
        RealMatrix v = svd.getV();
        double largest = singular[0];
        double[] errors = new double[p];
        for (int i = 0; i < p; i++) {
            double determined = 0;
            double undetermined = 0;
            for (int k = 0; k < singular.length; k++) {
                double loading = v.getEntry(i, k);
                if (singular[k] > NEAR_SINGULAR * largest) {
                    determined += loading * loading / (singular[k] * singular[k]);
                } else if (loading != 0) {
                    undetermined += singular[k] > 0
                            ? loading * loading / (singular[k] * singular[k])
                            : Double.POSITIVE_INFINITY;
                }
            }
            double variance = determined + undetermined;
            boolean supported = scale[i] > 0
                    && largest > 0
                    && Double.isFinite(variance)
                    && undetermined <= UNDETERMINED_SHARE * variance;
            errors[i] = supported ? Math.sqrt(residualVariance * variance) / scale[i] : Double.NaN;
        }
        return errors;
    }
}
