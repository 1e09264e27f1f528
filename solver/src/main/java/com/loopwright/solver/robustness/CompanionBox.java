package com.loopwright.solver.robustness;

import com.loopwright.solver.plant.CompanionPlant;
import java.util.ArrayList;
import java.util.List;

/**
 * Closed intervals for the coefficients of a companion plant of order n: a_0 .. a_{n-1} of its monic denominator
 * (lowest power first, as {@link CompanionPlant}) and the input gain b (lo == hi for a fixed parameter). The
 * numerator and the disturbance vector are fixed. A b interval must not contain 0; at most {@value #MAX_RANGED}
 * parameters are ranged (at most 16 corners).
 *
 * <p>Parameter order (corners and samples): the wire's, a_{n-1} .. a_0 (highest power first), then b. Corner k
 * takes the highest value of the j-th ranged parameter when bit j of k is set (binary order over the ranged
 * parameters, the first one in the lowest bit). Sample s draws one uniform u for every parameter in that order,
 * ranged or not: p = lo + (hi - lo) u, from the one {@link ParameterSampler} (SplittableRandom with the caller's
 * seed).
 *
 * @param denominatorLows  a_0 .. a_{n-1} lower ends
 * @param denominatorHighs a_0 .. a_{n-1} upper ends
 * @param bLow             lower end of b
 * @param bHigh            upper end of b
 */
public record CompanionBox(double[] denominatorLows, double[] denominatorHighs, double bLow, double bHigh) {

    /** Ranged parameters at most (2^4 = 16 corners, as the two-state box). */
    public static final int MAX_RANGED = 4;

    public CompanionBox {
        denominatorLows = denominatorLows.clone();
        denominatorHighs = denominatorHighs.clone();
        int n = denominatorLows.length;
        if (n < CompanionPlant.MIN_ORDER || n > CompanionPlant.MAX_ORDER || denominatorHighs.length != n) {
            throw new IllegalArgumentException("one range per denominator coefficient a_0 .. a_{n-1}");
        }
        for (int i = 0; i < n; i++) {
            check(denominatorLows[i], denominatorHighs[i]);
        }
        check(bLow, bHigh);
        if (bLow <= 0 && bHigh >= 0) {
            throw new IllegalArgumentException("the input gain range must not contain 0");
        }
        if (ranged(denominatorLows, denominatorHighs, bLow, bHigh).size() > MAX_RANGED) {
            throw new IllegalArgumentException("at most " + MAX_RANGED + " ranged parameters");
        }
    }

    @Override
    public double[] denominatorLows() {
        return denominatorLows.clone();
    }

    @Override
    public double[] denominatorHighs() {
        return denominatorHighs.clone();
    }

    /** The plant's order n. */
    public int order() {
        return denominatorLows.length;
    }

    /** Number of ranged parameters. */
    public int rangedCount() {
        return ranged(denominatorLows, denominatorHighs, bLow, bHigh).size();
    }

    /** The 2^m corners (m ranged parameters), the nominal's numerator and disturbance kept. */
    public List<CompanionPlant> corners(CompanionPlant nominal) {
        double[] lo = lows();
        double[] hi = highs();
        List<Integer> ranged = ranged(denominatorLows, denominatorHighs, bLow, bHigh);
        List<CompanionPlant> corners = new ArrayList<>();
        for (int mask = 0; mask < (1 << ranged.size()); mask++) {
            double[] p = lo.clone();
            for (int bit = 0; bit < ranged.size(); bit++) {
                int index = ranged.get(bit);
                p[index] = (mask >> bit & 1) == 1 ? hi[index] : lo[index];
            }
            corners.add(plant(p, nominal));
        }
        return corners;
    }

    /** The first {@code count} seeded samples, the nominal's numerator and disturbance kept. */
    public List<CompanionPlant> samples(CompanionPlant nominal, int count, long seed) {
        double[] lo = lows();
        double[] hi = highs();
        ParameterSampler sampler = new ParameterSampler(lo, hi, seed);
        List<CompanionPlant> samples = new ArrayList<>(count);
        for (int s = 0; s < count; s++) {
            samples.add(plant(sampler.next(), nominal));
        }
        return samples;
    }

    /** Parameters in wire order: a_{n-1} .. a_0, b. */
    private double[] lows() {
        return wireOrder(denominatorLows, bLow);
    }

    private double[] highs() {
        return wireOrder(denominatorHighs, bHigh);
    }

    private static double[] wireOrder(double[] lowestFirst, double b) {
        int n = lowestFirst.length;
        double[] p = new double[n + 1];
        for (int i = 0; i < n; i++) {
            p[i] = lowestFirst[n - 1 - i];
        }
        p[n] = b;
        return p;
    }

    private static CompanionPlant plant(double[] wire, CompanionPlant nominal) {
        int n = wire.length - 1;
        double[] a = new double[n];
        for (int i = 0; i < n; i++) {
            a[i] = wire[n - 1 - i];
        }
        return new CompanionPlant(a, nominal.numerator(), wire[n], nominal.disturbance());
    }

    /** Indices (wire order) of the ranged parameters. */
    private static List<Integer> ranged(double[] lows, double[] highs, double bLow, double bHigh) {
        double[] lo = wireOrder(lows, bLow);
        double[] hi = wireOrder(highs, bHigh);
        List<Integer> out = new ArrayList<>();
        for (int i = 0; i < lo.length; i++) {
            if (lo[i] < hi[i]) {
                out.add(i);
            }
        }
        return out;
    }

    private static void check(double lo, double hi) {
        if (!Double.isFinite(lo) || !Double.isFinite(hi)) {
            throw new IllegalArgumentException("parameter bounds must be finite");
        }
        if (lo > hi) {
            throw new IllegalArgumentException("each parameter range needs lowest <= highest");
        }
    }
}
