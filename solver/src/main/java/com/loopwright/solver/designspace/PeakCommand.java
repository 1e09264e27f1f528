package com.loopwright.solver.designspace;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;

/**
 * Exact peak |u| of the unit reference step of a stable two-state loop, without a simulation. The closed loop
 * x' = Ac x + [0, b kr]' r has characteristic polynomial s^2 + c1 s + c0 (c0 = a0 + b k1, c1 = a1 + b k2) and
 * rest state x_inf = [b kr/c0, 0]'. With e = x - x_inf, u = kr - K x = u_inf + f(t), where f = -K e solves
 * f'' + c1 f' + c0 f = 0 with f(0) = k1 x1_inf and f'(0) = -k2 c0 x1_inf (e(0) = -x_inf, e' = Ac e). The peak is
 * the largest of |u(0+)| = |u_inf + f(0)|, |u_inf| (the limit) and |u_inf + f| at the zeros of f' for t &gt; 0:
 * for a complex pair f' = exp(-sigma t) R cos(w t - phi) vanishes at w t = phi + pi/2 + n pi, for real poles at
 * most once.
 */
public final class PeakCommand {

    /** Extrema of an oscillating f examined at most (the envelope usually ends the scan much earlier). */
    static final int MAX_EXTREMA = 400;
    /** Relative distance of the poles below which they are treated as one double pole. */
    static final double DOUBLE_POLE_TOLERANCE = 1e-7;

    private PeakCommand() {}

    /** Peak |u| for a unit step; the loop must be stable (c0 &gt; 0, c1 &gt; 0). */
    public static double ofUnitStep(CanonicalPlant plant, FeedbackGains gains) {
        double c0 = plant.a0() + plant.b() * gains.positionGain();
        double c1 = plant.a1() + plant.b() * gains.velocityGain();
        if (!(c0 > 0 && c1 > 0)) {
            throw new IllegalArgumentException("the loop is not stable");
        }
        double x1Final = plant.b() * gains.referenceGain() / c0;
        double uFinal = gains.referenceGain() - gains.positionGain() * x1Final;
        double f0 = gains.positionGain() * x1Final;
        double df0 = -gains.velocityGain() * c0 * x1Final;
        return supremum(c0, c1, uFinal, f0, df0);
    }

    /**
     * sup over t &gt;= 0 of |offset + f(t)|, f'' + c1 f' + c0 f = 0, f(0) = f0, f'(0) = df0, c0, c1 &gt; 0.
     */
    static double supremum(double c0, double c1, double offset, double f0, double df0) {
        double best = Math.max(Math.abs(offset + f0), Math.abs(offset));
        double sigma = c1 / 2;
        double discriminant = sigma * sigma - c0;
        double ddf0 = -c1 * df0 - c0 * f0;
        if (discriminant < -DOUBLE_POLE_TOLERANCE * c0) {
            // f = exp(-sigma t)(f0 cos wt + B sin wt), f' = exp(-sigma t)(df0 cos wt + B' sin wt)
            double w = Math.sqrt(-discriminant);
            double sine = (df0 + sigma * f0) / w;
            double derivativeSine = (ddf0 + sigma * df0) / w;
            double amplitude = Math.hypot(f0, sine);
            double phi = Math.atan2(derivativeSine, df0);
            double first = phi + Math.PI / 2;
            long n = (long) Math.ceil(-first / Math.PI);
            for (int k = 0; k < MAX_EXTREMA; k++, n++) {
                double t = (first + n * Math.PI) / w;
                if (t <= 0) {
                    continue;
                }
                double envelope = Math.exp(-sigma * t);
                if (Math.abs(offset) + amplitude * envelope <= best) {
                    break; // every later extremum lies inside the decaying envelope
                }
                double f = envelope * (f0 * Math.cos(w * t) + sine * Math.sin(w * t));
                best = Math.max(best, Math.abs(offset + f));
            }
            return best;
        }
        if (Math.abs(discriminant) <= DOUBLE_POLE_TOLERANCE * c0) {
            // double pole p: f = (f0 + g t) exp(p t), g = df0 - p f0; f' = (df0 + p g t) exp(p t)
            double p = -sigma;
            double g = df0 - p * f0;
            double t = p * g == 0 ? -1 : -df0 / (p * g);
            if (t > 0) {
                best = Math.max(best, Math.abs(offset + (f0 + g * t) * Math.exp(p * t)));
            }
            return best;
        }
        // two real poles p1 > p2: f = A exp(p1 t) + B exp(p2 t); f' = 0 where exp((p1 - p2) t) = -p2 B/(p1 A)
        double root = Math.sqrt(discriminant);
        double p1 = -sigma + root;
        double p2 = -sigma - root;
        double a = (df0 - p2 * f0) / (p1 - p2);
        double b = f0 - a;
        double ratio = -p2 * b / (p1 * a);
        if (ratio > 0 && Double.isFinite(ratio)) {
            double t = Math.log(ratio) / (p1 - p2);
            if (t > 0) {
                best = Math.max(best, Math.abs(offset + a * Math.exp(p1 * t) + b * Math.exp(p2 * t)));
            }
        }
        return best;
    }
}
