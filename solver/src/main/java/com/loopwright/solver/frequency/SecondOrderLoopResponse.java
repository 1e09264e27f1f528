package com.loopwright.solver.frequency;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import java.util.ArrayList;
import java.util.List;

/**
 * The loop of the canonical plant under state feedback in closed form: L(s) = b (k1 + k2 s)/(s^2 + a1 s + a0) at the
 * plant input, S = 1/(1 + L) and T = b kr/(s^2 + c1 s + c0) from reference to x1, their crossings, bandwidth and
 * peak sensitivity. {@link LoopFrequencyAnalyzer#margins} assembles the margins from these.
 *
 * <p>Gain crossovers: |L(j w)|^2 = 1 is b^2 (k1^2 + k2^2 w^2) = (a0 - w^2)^2 + a1^2 w^2, a quadratic in s = w^2:
 * s^2 + (a1^2 - 2 a0 - b^2 k2^2) s + (a0^2 - b^2 k1^2) = 0. Phase crossovers: Im L(j w) = 0 is
 * b w (k2 (a0 - w^2) - k1 a1) = 0, so w = 0 or w^2 = a0 - k1 a1 / k2. Bandwidth: |T(j w)|^2 = |T(0)|^2 / 2 with
 * T = b kr/(s^2 + c1 s + c0) gives s^2 + (c1^2 - 2 c0) s - c0^2 = 0. The peak sensitivity is found on a log grid of
 * {@value #SENSITIVITY_GRID} points (three decades either side of the closed-loop poles) and refined by golden
 * section over the bracketing grid cells. L is strictly proper, so |S| tends to 1 at high frequency and the peak
 * sensitivity is never below 1; when the grid finds nothing above 1 the supremum 1 is approached as w -> infinity.
 */
public final class SecondOrderLoopResponse {

    private SecondOrderLoopResponse() {}

    static final int SENSITIVITY_GRID = 4000;
    static final int GOLDEN_ITERATIONS = 100;
    static final double DECADES_EACH_SIDE = 3;

    /** L(j w) = b (k1 + j k2 w) / (a0 - w^2 + j a1 w), as {re, im}. */
    public static double[] loop(CanonicalPlant plant, FeedbackGains gains, double w) {
        double nr = plant.b() * gains.positionGain();
        double ni = plant.b() * gains.velocityGain() * w;
        double dr = plant.a0() - w * w;
        double di = plant.a1() * w;
        double den = dr * dr + di * di;
        return new double[] {(nr * dr + ni * di) / den, (ni * dr - nr * di) / den};
    }

    /** arg L(j w) in radians, taken as arg(numerator) - arg(denominator) so that it is continuous in w. */
    public static double loopPhase(CanonicalPlant plant, FeedbackGains gains, double w) {
        double numerator = Math.atan2(plant.b() * gains.velocityGain() * w, plant.b() * gains.positionGain());
        double denominator = Math.atan2(plant.a1() * w, plant.a0() - w * w);
        return numerator - denominator;
    }

    /** |S(j w)| = 1 / |1 + L(j w)|. */
    public static double sensitivity(CanonicalPlant plant, FeedbackGains gains, double w) {
        double[] l = loop(plant, gains, w);
        return 1 / Math.hypot(1 + l[0], l[1]);
    }

    /** T(j w) = b kr / (c0 - w^2 + j c1 w). */
    public static double[] closedLoop(CanonicalPlant plant, FeedbackGains gains, double w) {
        double n = plant.b() * gains.referenceGain();
        double dr = LoopMatrices.closedLoopStiffness(plant, gains) - w * w;
        double di = LoopMatrices.closedLoopDamping(plant, gains) * w;
        double den = dr * dr + di * di;
        return new double[] {n * dr / den, -n * di / den};
    }

    /** Positive real roots of a s^2 + b s + c (stable form of the quadratic formula). */
    static List<Double> positiveRoots(double a, double b, double c) {
        List<Double> roots = new ArrayList<>(2);
        double discriminant = b * b - 4 * a * c;
        if (discriminant < 0) {
            return roots;
        }
        double q = -0.5 * (b + Math.copySign(Math.sqrt(discriminant), b));
        double r1 = q / a;
        double r2 = q == 0 ? 0 : c / q;
        if (r1 > 0) {
            roots.add(r1);
        }
        if (r2 > 0 && r2 != r1) {
            roots.add(r2);
        }
        return roots;
    }

    /** {frequency, max |S|} on a log grid refined by golden section. */
    static double[] peakSensitivity(CanonicalPlant plant, FeedbackGains gains, double low, double high) {
        double ratio = Math.pow(high / low, 1.0 / (SENSITIVITY_GRID - 1));
        int best = 0;
        double bestValue = -1;
        for (int i = 0; i < SENSITIVITY_GRID; i++) {
            double value = sensitivity(plant, gains, low * Math.pow(ratio, i));
            if (value > bestValue) {
                bestValue = value;
                best = i;
            }
        }
        double bestW = low * Math.pow(ratio, best);
        if (best == SENSITIVITY_GRID - 1) {
            // |S| -> 1 as w -> infinity from below or above; report the grid end
            return new double[] {bestW, bestValue};
        }
        double lo = Math.log(best == 0 ? low : low * Math.pow(ratio, best - 1));
        double hi = Math.log(low * Math.pow(ratio, best + 1));
        double g = (Math.sqrt(5) - 1) / 2;
        for (int i = 0; i < GOLDEN_ITERATIONS && hi - lo > 1e-14 * Math.max(1, Math.abs(hi)); i++) {
            double m1 = hi - g * (hi - lo);
            double m2 = lo + g * (hi - lo);
            if (sensitivity(plant, gains, Math.exp(m1)) >= sensitivity(plant, gains, Math.exp(m2))) {
                hi = m2;
            } else {
                lo = m1;
            }
        }
        double w = Math.exp(0.5 * (lo + hi));
        double value = sensitivity(plant, gains, w);
        return value >= bestValue ? new double[] {w, value} : new double[] {bestW, bestValue};
    }
}
