package com.loopwright.solver.plant;

import java.util.Arrays;
import org.ejml.data.DMatrixRMaj;

/**
 * A plant of order n in controllable canonical (companion) form:
 * <pre>
 *   z_i' = z_{i+1} (i &lt; n),   z_n' = -(a_0 z_1 + ... + a_{n-1} z_n) + b u + (disturbance . w)_n,
 *   x' = A z + B2 u + B1 w,  B2 = b e_n,  B1 = disturbance,  y = c_0 z_1 + ... + c_{n-1} z_n.
 * </pre>
 * The transfer function from u to y is b (c_{n-1} s^{n-1} + ... + c_0) / (s^n + a_{n-1} s^{n-1} + ... + a_0).
 *
 * @param denominator a_0 .. a_{n-1}, the characteristic polynomial's coefficients below the leading 1
 * @param numerator   c_0 .. c_{n-1}, the output row (zeros of the plant), c_0 != 0 for a non-zero DC gain
 * @param b           input gain, non-zero
 * @param disturbance B1, one entry per state, not all zero
 */
public record CompanionPlant(double[] denominator, double[] numerator, double b, double[] disturbance) {

    public static final int MIN_ORDER = 2;
    public static final int MAX_ORDER = 8;

    public CompanionPlant {
        int n = denominator.length;
        if (n < MIN_ORDER || n > MAX_ORDER) {
            throw new IllegalArgumentException("order must lie in [" + MIN_ORDER + ", " + MAX_ORDER + "], got " + n);
        }
        if (numerator.length != n || disturbance.length != n) {
            throw new IllegalArgumentException("numerator and disturbance need " + n + " entries");
        }
        if (!(b != 0) || !Double.isFinite(b)) {
            throw new IllegalArgumentException("b must be finite and non-zero");
        }
        denominator = finite(denominator, "denominator");
        numerator = finite(numerator, "numerator");
        disturbance = finite(disturbance, "disturbance");
        if (Arrays.stream(disturbance).allMatch(v -> v == 0)) {
            throw new IllegalArgumentException("the disturbance vector must not be zero");
        }
    }

    public int order() {
        return denominator.length;
    }

    @Override
    public double[] denominator() {
        return denominator.clone();
    }

    @Override
    public double[] numerator() {
        return numerator.clone();
    }

    @Override
    public double[] disturbance() {
        return disturbance.clone();
    }

    /** A: ones on the superdiagonal, -a_0 .. -a_{n-1} in the last row. */
    public DMatrixRMaj stateMatrix() {
        int n = order();
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int i = 0; i + 1 < n; i++) {
            a.set(i, i + 1, 1);
        }
        for (int j = 0; j < n; j++) {
            a.set(n - 1, j, -denominator[j]);
        }
        return a;
    }

    /** B2 = b e_n. */
    public DMatrixRMaj controlInput() {
        DMatrixRMaj b2 = new DMatrixRMaj(order(), 1);
        b2.set(order() - 1, 0, b);
        return b2;
    }

    /** B1 = the disturbance vector, as a column. */
    public DMatrixRMaj disturbanceInput() {
        return new DMatrixRMaj(order(), 1, true, disturbance);
    }

    /** The output row c. */
    public DMatrixRMaj outputRow() {
        return new DMatrixRMaj(1, order(), true, numerator);
    }

    /** True when B1 is a multiple of e_n (the disturbance enters where u does): then the Riccati system is linear. */
    public boolean matchedDisturbance() {
        for (int i = 0; i + 1 < order(); i++) {
            if (disturbance[i] != 0) {
                return false;
            }
        }
        return true;
    }

    private static double[] finite(double[] values, String name) {
        for (double v : values) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException(name + " must be finite");
            }
        }
        return values.clone();
    }
}
