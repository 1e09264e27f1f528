package com.loopwright.solver.numeric;

import java.util.function.DoubleUnaryOperator;

/**
 * The solver's one root finder on a bracket [lo, hi] where a continuous f changes sign, with two stopping rules:
 * {@link #brent} (the classic zeroin: inverse quadratic interpolation and secant steps, safeguarded by bisection,
 * stops within a few ulps) for the event refinement between simulation samples, and {@link #bisection} (halving
 * until the bracket is two adjacent doubles) for the spec inversions and the saturation switching instants.
 *
 * <p>Why in-house and why both rules: responses print every double in full (round-trip digits), so a root that
 * moves by one ulp changes the bytes of an answer. Tried on the golden corpus (326 recorded exchanges):
 * Hipparchus' {@code BracketingNthOrderBrentSolver} (order 5, relative accuracy 1e-16) for every root changed 159
 * responses; zeroin in place of bisection changed 109, bisection in place of zeroin 107. Hipparchus'
 * {@code BisectionSolver} cannot run to adjacent doubles (an absolute accuracy of 0 ends in its evaluation cap) and
 * evaluates f twice per halving. A change of rule is an answer change, to be made with a recorded corpus.
 */
public final class BracketedRoot {

    /** Iteration cap of {@link #brent}; smooth functions on a sample interval converge in about 10. */
    public static final int MAX_ITERATIONS = 100;
    /** Hard cap on halvings of {@link #bisection}: 2^-200 of any finite bracket is below one ulp. */
    public static final int MAX_HALVINGS = 200;

    private static final double EPSILON = Math.ulp(1.0);

    private BracketedRoot() {}

    /**
     * Brent's method. Returns t in [lo, hi] with f(t) = 0 to within a few ulps of t. The end values are taken as
     * given (callers may know them more accurately than f evaluates them) and must differ in sign
     * or be zero.
     */
    public static double brent(DoubleUnaryOperator f, double lo, double hi, double fLo, double fHi) {
        if (!(lo < hi)) {
            throw new IllegalArgumentException("bracket must satisfy lo < hi, got [" + lo + ", " + hi + "]");
        }
        if (!Double.isFinite(fLo) || !Double.isFinite(fHi)) {
            throw new IllegalArgumentException("bracket values must be finite");
        }
        if (fLo == 0.0) {
            return lo;
        }
        if (fHi == 0.0) {
            return hi;
        }
        if ((fLo > 0.0) == (fHi > 0.0)) {
            throw new IllegalArgumentException("no sign change on [" + lo + ", " + hi + "]: f = " + fLo + ", " + fHi);
        }
        double absoluteTolerance = 2.0 * Math.ulp(Math.max(Math.abs(lo), Math.abs(hi)));
        // b is the best estimate, c the other end of the bracket, a the previous b.
        double a = lo;
        double fa = fLo;
        double b = hi;
        double fb = fHi;
        double c = a;
        double fc = fa;
        double d = b - a;
        double e = d;
        for (int iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
            if ((fb > 0.0) == (fc > 0.0)) {
                c = a;
                fc = fa;
                d = b - a;
                e = d;
            }
            if (Math.abs(fc) < Math.abs(fb)) {
                a = b;
                b = c;
                c = a;
                fa = fb;
                fb = fc;
                fc = fa;
            }
            double tolerance = 2.0 * EPSILON * Math.abs(b) + 0.5 * absoluteTolerance;
            double halfWidth = 0.5 * (c - b);
            if (Math.abs(halfWidth) <= tolerance || fb == 0.0) {
                return b;
            }
            if (Math.abs(e) >= tolerance && Math.abs(fa) > Math.abs(fb)) {
                double p;
                double q;
                double s = fb / fa;
                if (a == c) {
                    // secant step
                    p = 2.0 * halfWidth * s;
                    q = 1.0 - s;
                } else {
                    // inverse quadratic interpolation through (a, fa), (b, fb), (c, fc)
                    double qa = fa / fc;
                    double rb = fb / fc;
                    p = s * (2.0 * halfWidth * qa * (qa - rb) - (b - a) * (rb - 1.0));
                    q = (qa - 1.0) * (rb - 1.0) * (s - 1.0);
                }
                if (p > 0.0) {
                    q = -q;
                } else {
                    p = -p;
                }
                if (2.0 * p < Math.min(3.0 * halfWidth * q - Math.abs(tolerance * q), Math.abs(e * q))) {
                    e = d;
                    d = p / q;
                } else {
                    d = halfWidth;
                    e = d;
                }
            } else {
                d = halfWidth;
                e = d;
            }
            a = b;
            fa = fb;
            b += Math.abs(d) > tolerance ? d : Math.copySign(tolerance, halfWidth);
            fb = f.applyAsDouble(b);
            if (!Double.isFinite(fb)) {
                throw new IllegalStateException("function is not finite at " + b + ": " + fb);
            }
        }
        throw new IllegalStateException(
                "root refinement on [" + lo + ", " + hi + "] did not converge in " + MAX_ITERATIONS + " iterations");
    }

    /**
     * Bisection: slow but cannot fail on a valid bracket; at most {@value #MAX_HALVINGS} halvings reach the spacing of
     * doubles.
     *
     * @param f  continuous on [lo, hi], with f(lo) and f(hi) of opposite sign (or one of them zero)
     * @return x in [lo, hi] with f(x) = 0 to within the resolution of doubles
     * @throws IllegalArgumentException when the ends do not bracket a sign change
     */
    public static double bisection(DoubleUnaryOperator f, double lo, double hi) {
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
        for (int i = 0; i < MAX_HALVINGS; i++) {
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
