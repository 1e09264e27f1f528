package com.loopwright.solver.simulation;

import com.loopwright.solver.linalg.MatrixExponential;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * Exact sampling of x' = A x + B u with u held constant between samples (zero-order hold).
 *
 * <p>Over one period T: x(t + T) = Ad x(t) + Bd u with Ad = e^(A T) and
 * Bd = (integral_0^T e^(A s) ds) B. Both come from Van Loan's block exponential:
 * exp([[A, B], [0, 0]] T) = [[Ad, Bd], [0, I]], which needs no inverse of A and so also holds
 * for singular A (integrators).
 */
public final class ZeroOrderHold {

    /** Largest state dimension n: the block matrix has n + m rows. */
    public static final int MAX_BLOCK_DIMENSION = MatrixExponential.MAX_DIMENSION;

    private ZeroOrderHold() {}

    /**
     * Discretizes x' = A x + B u exactly for piecewise-constant u.
     *
     * @param a state matrix, n x n, finite
     * @param b input matrix, n x m with m >= 1 and n + m <= {@value #MAX_BLOCK_DIMENSION}, finite
     * @param samplePeriod hold period T in seconds, finite and positive
     * @throws IllegalArgumentException on null, mismatched or non-finite arguments, on a
     *     non-positive period, or if the exponential of the block matrix cannot be formed
     */
    public static DiscreteStateSpace discretize(DMatrixRMaj a, DMatrixRMaj b, double samplePeriod) {
        if (a == null || b == null) {
            throw new IllegalArgumentException("a and b must not be null");
        }
        int n = a.numRows;
        if (a.numCols != n || n < 1) {
            throw new IllegalArgumentException("a must be square and non-empty, got " + a.numRows + " x " + a.numCols);
        }
        int m = b.numCols;
        if (b.numRows != n || m < 1) {
            throw new IllegalArgumentException(
                    "b must be " + n + " x m with m >= 1, got " + b.numRows + " x " + b.numCols);
        }
        if (n + m > MAX_BLOCK_DIMENSION) {
            throw new IllegalArgumentException("n + m must be at most " + MAX_BLOCK_DIMENSION + ", got " + (n + m));
        }
        if (!(samplePeriod > 0.0) || !Double.isFinite(samplePeriod)) {
            throw new IllegalArgumentException("samplePeriod must be finite and positive, got " + samplePeriod);
        }
        MatrixChecks.requireFinite(a, "a");
        MatrixChecks.requireFinite(b, "b");

        // M = [[A T, B T], [0, 0]]; e^M = [[Ad, Bd], [0, I]].
        DMatrixRMaj block = new DMatrixRMaj(n + m, n + m);
        CommonOps_DDRM.insert(a, block, 0, 0);
        CommonOps_DDRM.insert(b, block, 0, n);
        CommonOps_DDRM.scale(samplePeriod, block);
        DMatrixRMaj blockExponential = MatrixExponential.of(block);
        DMatrixRMaj ad = CommonOps_DDRM.extract(blockExponential, 0, n, 0, n);
        DMatrixRMaj bd = CommonOps_DDRM.extract(blockExponential, 0, n, n, n + m);
        return new DiscreteStateSpace(ad, bd, samplePeriod);
    }
}
