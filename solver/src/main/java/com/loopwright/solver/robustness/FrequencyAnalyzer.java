package com.loopwright.solver.robustness;

import com.loopwright.solver.loop.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.frequency.CrossoverMargins;
import com.loopwright.solver.plant.CanonicalPlant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Margins of L(s) = b (k1 + k2 s)/(s^2 + a1 s + a0) in closed form. Every gain crossover counts; phase and delay
 * margins follow the rule of {@link CrossoverMargins}, which the Bode figure shares.
 *
 * <p>Gain crossovers: |L(j w)|^2 = 1 is b^2 (k1^2 + k2^2 w^2) = (a0 - w^2)^2 + a1^2 w^2, a quadratic in s = w^2:
 * s^2 + (a1^2 - 2 a0 - b^2 k2^2) s + (a0^2 - b^2 k1^2) = 0. Phase crossovers: Im L(j w) = 0 is
 * b w (k2 (a0 - w^2) - k1 a1) = 0, so w = 0 or w^2 = a0 - k1 a1 / k2. Bandwidth: |T(j w)|^2 = |T(0)|^2 / 2 with
 * T = b kr/(s^2 + c1 s + c0) gives s^2 + (c1^2 - 2 c0) s - c0^2 = 0. The peak sensitivity is found on a log grid of
 * {@value #SENSITIVITY_GRID} points (three decades either side of the closed-loop poles) and refined by golden
 * section over the bracketing grid cells. L is strictly proper, so |S| tends to 1 at high frequency and the peak
 * sensitivity is never below 1; when the grid finds nothing above 1 the supremum 1 is approached as w -> infinity.
 */
public final class FrequencyAnalyzer {

    /** Cap on frequency response points returned. */
    public static final int MAX_RESPONSE_POINTS = 500;
    static final int SENSITIVITY_GRID = 4000;
    static final int GOLDEN_ITERATIONS = 100;
    static final double DECADES_EACH_SIDE = 3;

    /**
     * @param responsePoints number of log-spaced points in the returned response, 0 to {@value #MAX_RESPONSE_POINTS}
     */
    public LoopMargins analyze(CanonicalPlant plant, FeedbackGains gains, int responsePoints) {
        if (responsePoints < 0 || responsePoints > MAX_RESPONSE_POINTS) {
            throw new IllegalArgumentException("responsePoints must be 0 to " + MAX_RESPONSE_POINTS);
        }
        double a0 = plant.a0();
        double a1 = plant.a1();
        double b = plant.b();
        double k1 = gains.positionGain();
        double k2 = gains.velocityGain();

        List<Double> roots = positiveRoots(1, a1 * a1 - 2 * a0 - b * b * k2 * k2, a0 * a0 - b * b * k1 * k1);
        double[] crossovers = new double[roots.size()];
        double[] phases = new double[roots.size()];
        for (int i = 0; i < crossovers.length; i++) {
            crossovers[i] = Math.sqrt(roots.get(i));
            phases[i] = loopPhase(plant, gains, crossovers[i]);
        }
        Optional<CrossoverMargins> phaseMargins = CrossoverMargins.of(crossovers, phases,
                LoopMatrices.stable(plant, gains));
        Double crossover = phaseMargins.map(CrossoverMargins::crossoverRadPerSec).orElse(null);
        Double phaseMargin = phaseMargins.map(CrossoverMargins::phaseMarginDegrees).orElse(null);
        Double delayMargin = phaseMargins.map(CrossoverMargins::delayMarginSeconds).orElse(null);

        Double gainMargin = null;
        Double gainMarginFrequency = null;
        Double gainReduction = null;
        List<Double> phaseCrossovers = new ArrayList<>();
        phaseCrossovers.add(0.0);
        if (k2 != 0) {
            double s = a0 - k1 * a1 / k2;
            if (s > 0) {
                phaseCrossovers.add(Math.sqrt(s));
            }
        }
        for (double w : phaseCrossovers) {
            double[] l = loop(plant, gains, w);
            if (!(l[0] < 0) || !Double.isFinite(l[0])) {
                continue; // real and positive (or at a pole): not a -180 degree crossing
            }
            double magnitude = Math.hypot(l[0], l[1]);
            if (magnitude < 1) {
                if (gainMargin == null || 1 / magnitude < gainMargin) {
                    gainMargin = 1 / magnitude;
                    gainMarginFrequency = w;
                }
            } else if (magnitude > 1) {
                gainReduction = gainReduction == null ? 1 / magnitude : Math.max(gainReduction, 1 / magnitude);
            }
        }

        double c0 = LoopMatrices.closedLoopStiffness(plant, gains);
        double c1 = LoopMatrices.closedLoopDamping(plant, gains);
        double p = c1 * c1 - 2 * c0;
        double bandwidthSquared = 0.5 * (-p + Math.hypot(p, 2 * c0));
        double bandwidth = Math.sqrt(bandwidthSquared);

        double center = Math.sqrt(Math.abs(c0));
        double low = center * Math.pow(10, -DECADES_EACH_SIDE);
        double high = center * Math.pow(10, DECADES_EACH_SIDE);
        if (crossover != null) {
            low = Math.min(low, crossover / 100);
            high = Math.max(high, crossover * 100);
        }
        double[] peak = peakSensitivity(plant, gains, low, high);

        List<FrequencyPoint> response = new ArrayList<>(responsePoints);
        double previousPhase = Double.NaN;
        for (int i = 0; i < responsePoints; i++) {
            double w = responsePoints == 1 ? center
                    : low * Math.pow(high / low, (double) i / (responsePoints - 1));
            double[] l = loop(plant, gains, w);
            double phase = Math.toDegrees(Math.atan2(l[1], l[0]));
            if (!Double.isNaN(previousPhase)) {
                while (phase - previousPhase > 180) {
                    phase -= 360;
                }
                while (phase - previousPhase < -180) {
                    phase += 360;
                }
            }
            previousPhase = phase;
            double[] t = closedLoop(plant, gains, w);
            response.add(new FrequencyPoint(w, 20 * Math.log10(Math.hypot(l[0], l[1])), phase,
                    20 * Math.log10(sensitivity(plant, gains, w)), 20 * Math.log10(Math.hypot(t[0], t[1]))));
        }
        // L is strictly proper, so |S(j w)| -> 1 as w -> infinity: the supremum is at least 1
        boolean finitePeak = peak[1] > 1;
        return new LoopMargins(crossover, phaseMargin, delayMargin, gainMargin, gainMarginFrequency, gainReduction,
                finitePeak ? peak[1] : 1.0, finitePeak ? peak[0] : null, bandwidth, response);
    }

    /** L(j w) = b (k1 + j k2 w) / (a0 - w^2 + j a1 w), as {re, im}. */
    static double[] loop(CanonicalPlant plant, FeedbackGains gains, double w) {
        double nr = plant.b() * gains.positionGain();
        double ni = plant.b() * gains.velocityGain() * w;
        double dr = plant.a0() - w * w;
        double di = plant.a1() * w;
        double den = dr * dr + di * di;
        return new double[] {(nr * dr + ni * di) / den, (ni * dr - nr * di) / den};
    }

    /** arg L(j w) in radians, taken as arg(numerator) - arg(denominator) so that it is continuous in w. */
    static double loopPhase(CanonicalPlant plant, FeedbackGains gains, double w) {
        double numerator = Math.atan2(plant.b() * gains.velocityGain() * w, plant.b() * gains.positionGain());
        double denominator = Math.atan2(plant.a1() * w, plant.a0() - w * w);
        return numerator - denominator;
    }

    /** |S(j w)| = 1 / |1 + L(j w)|. */
    static double sensitivity(CanonicalPlant plant, FeedbackGains gains, double w) {
        double[] l = loop(plant, gains, w);
        return 1 / Math.hypot(1 + l[0], l[1]);
    }

    /** T(j w) = b kr / (c0 - w^2 + j c1 w). */
    static double[] closedLoop(CanonicalPlant plant, FeedbackGains gains, double w) {
        double n = plant.b() * gains.referenceGain();
        double dr = LoopMatrices.closedLoopStiffness(plant, gains) - w * w;
        double di = LoopMatrices.closedLoopDamping(plant, gains) * w;
        double den = dr * dr + di * di;
        return new double[] {n * dr / den, -n * di / den};
    }

    /** Positive real roots of a s^2 + b s + c (stable form of the quadratic formula). */
    private static List<Double> positiveRoots(double a, double b, double c) {
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
    private static double[] peakSensitivity(CanonicalPlant plant, FeedbackGains gains, double low, double high) {
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
