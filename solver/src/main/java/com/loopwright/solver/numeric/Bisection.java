package com.loopwright.solver.numeric;

import java.util.function.DoubleUnaryOperator;

/**
 * Root of a continuous function on a bracket [lo, hi] where it changes sign, by bisection.
 * Bisection is slow but cannot fail on a valid bracket; 200 halvings reach the spacing of doubles.
 */
public final class Bisection {

    /** Hard cap on halvings: 2^-200 of any finite bracket is below one ulp. */
    public static final int MAX_ITERATIONS = 200;

    private Bisection() {
    }

    /**
     * @param f  continuous on [lo, hi], with f(lo) and f(hi) of opposite sign (or one of them zero)
     * @return x in [lo, hi] with f(x) = 0 to within the resolution of doubles
     * @throws IllegalArgumentException when the ends do not bracket a sign change
     */
    public static double root(DoubleUnaryOperator f, double lo, double hi) {
        double fLo = f.applyAsDouble(lo);
        double fHi = f.applyAsDouble(hi);
        if (fLo == 0) {
            return lo;
        }
        if (fHi == 0) {
            return hi;
        }
        if (!(Math.signum(fLo) * Math.signum(fHi) < 0)) {
            throw new IllegalArgumentException("no sign change on [" + lo + ", " + hi + "]");
        }
        for (int i = 0; i < MAX_ITERATIONS; i++) {
            double mid = 0.5 * (lo + hi);
            if (mid <= lo || mid >= hi) {
                break;
            }
            double fMid = f.applyAsDouble(mid);
            if (fMid == 0) {
                return mid;
            }
            if (Math.signum(fMid) == Math.signum(fLo)) {
                lo = mid;
                fLo = fMid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
