package com.loopwright.solver.numeric;

import java.util.function.DoublePredicate;

/**
 * Bisection in log x of a monotone predicate over a positive bracket: each step probes the geometric mean
 * sqrt(lo hi), so n steps narrow [lo, hi] to a ratio (hi / lo)^(2^-n). For searches over frequencies, where the
 * scale, not the offset, matters. The caller caps n; the predicate is probed exactly n times.
 */
public final class GeometricBisection {

    private GeometricBisection() {}

    /**
     * The predicate false below some x* and true above it, true at hi: the smallest probed x where it holds.
     *
     * @param halvings steps, each one probe
     */
    public static double lowestTrue(double lo, double hi, int halvings, DoublePredicate holds) {
        for (int i = 0; i < halvings; i++) {
            double mid = Math.sqrt(lo * hi);
            if (holds.test(mid)) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }

    /**
     * The predicate true below some x* and false above it, true at lo: the largest probed x where it holds.
     *
     * @param halvings steps, each one probe
     */
    public static double highestTrue(double lo, double hi, int halvings, DoublePredicate holds) {
        for (int i = 0; i < halvings; i++) {
            double mid = Math.sqrt(lo * hi);
            if (holds.test(mid)) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
