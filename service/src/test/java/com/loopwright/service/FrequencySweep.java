package com.loopwright.service;

import java.util.function.DoubleUnaryOperator;

/**
 * The peak of a frequency response gain |G(jw)|, test-side and independent of the service's norm: a log grid of 4000
 * points from 1e-3 to 1e4 rad/s, then a golden-section search of 80 steps between the best point's neighbours
 * (common practice).
 */
final class FrequencySweep {

    private static final int POINTS = 4000;

    private FrequencySweep() {}

    static double peak(DoubleUnaryOperator gain) {
        double best = 0;
        double bestW = 0;
        for (int i = 0; i <= POINTS; i++) {
            double w = Math.pow(10, -3 + 7.0 * i / POINTS);
            double g = gain.applyAsDouble(w);
            if (g > best) {
                best = g;
                bestW = w;
            }
        }
        double lo = bestW / Math.pow(10, 7.0 / POINTS);
        double hi = bestW * Math.pow(10, 7.0 / POINTS);
        double ratio = (Math.sqrt(5) - 1) / 2;
        for (int i = 0; i < 80; i++) {
            double m1 = hi - ratio * (hi - lo);
            double m2 = lo + ratio * (hi - lo);
            if (gain.applyAsDouble(m1) > gain.applyAsDouble(m2)) {
                hi = m2;
            } else {
                lo = m1;
            }
        }
        return Math.max(best, gain.applyAsDouble((lo + hi) / 2));
    }
}
