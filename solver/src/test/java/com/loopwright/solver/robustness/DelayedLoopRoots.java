package com.loopwright.solver.robustness;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;

/**
 * Independent reference for delay margins, with no Pade approximation: the number of right-half-plane zeros of
 * the delayed closed-loop characteristic function chi(s) = s^2 + a1 s + a0 + b (k1 + k2 s) e^(-s tau), by the
 * argument principle on the imaginary axis (e.g. Stepan, Retarded Dynamical Systems, ch. 2; for a retarded
 * quasi-polynomial of principal term s^n the change of arg chi(j w) over w in [0, inf) is (n - 2 Z) pi / 2, as for
 * a polynomial of degree n). Here n = 2, so Z = 1 - (change of arg) / pi, evaluated on a dense grid up to a
 * frequency where s^2 dominates the rest by a factor of {@value #DOMINANCE}.
 */
final class DelayedLoopRoots {

    static final double DOMINANCE = 1000;
    /** Grid step as a fraction of the finest time scale of chi. */
    static final double STEP_FRACTION = 0.01;

    static final int MAX_POINTS = 50_000_000;

    private DelayedLoopRoots() {}

    /** Zeros of chi in the open right half plane (chi must have none on the imaginary axis). */
    static int rightHalfPlaneZeros(CanonicalPlant plant, FeedbackGains gains, double delaySeconds) {
        double a0 = plant.a0();
        double a1 = plant.a1();
        double n0 = plant.b() * gains.positionGain();
        double n1 = plant.b() * gains.velocityGain();
        double scale = Math.abs(a0) + Math.abs(a1) + Math.abs(n0) + Math.abs(n1);
        double top = Math.sqrt(DOMINANCE * scale) + DOMINANCE * (Math.abs(a1) + Math.abs(n1));
        // the finest features: the delay's rotation (period 2 pi / tau) and the undelayed loop's damping and frequency
        double step = STEP_FRACTION
                / Math.max(delaySeconds, Math.max(1 / Math.abs(a1 + n1), 1 / Math.sqrt(Math.abs(a0 + n0))));
        long points = (long) Math.ceil(top / step);
        if (points > MAX_POINTS) {
            throw new IllegalArgumentException("grid too large: " + points);
        }
        double previous = arg(a0, a1, n0, n1, delaySeconds, 0);
        double total = 0;
        for (long i = 1; i <= points; i++) {
            double w = top * i / points;
            double current = arg(a0, a1, n0, n1, delaySeconds, w);
            double change = current - previous;
            change -= 2 * Math.PI * Math.rint(change / (2 * Math.PI));
            if (Math.abs(change) > Math.PI / 2) {
                throw new IllegalStateException("grid too coarse at w = " + w);
            }
            total += change;
            previous = current;
        }
        return (int) Math.rint(1 - total / Math.PI);
    }

    private static double arg(double a0, double a1, double n0, double n1, double tau, double w) {
        // chi(jw) = (a0 - w^2) + j a1 w + (n0 + j n1 w)(cos w tau - j sin w tau)
        double c = Math.cos(w * tau);
        double s = Math.sin(w * tau);
        double re = a0 - w * w + n0 * c + n1 * w * s;
        double im = a1 * w + n1 * w * c - n0 * s;
        return Math.atan2(im, re);
    }
}
