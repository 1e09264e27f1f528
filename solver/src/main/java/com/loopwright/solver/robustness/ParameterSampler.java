package com.loopwright.solver.robustness;

import java.util.SplittableRandom;

/**
 * The seeded uniform samples of a parameter box, one definition for every consumer (the robustness report and
 * the uncertainty-band figure), so one seed means one set of parameter sets everywhere. Sample s is
 * p_i = lo_i + (hi_i - lo_i) u_{4s+i}, i = a0, a1, b, d in that order, with u drawn from {@link SplittableRandom}
 * seeded with the caller's seed; a consumer that draws fewer samples sees a prefix of the same sequence.
 */
public final class ParameterSampler {

    private final double[] lows;
    private final double[] highs;
    private final SplittableRandom random;

    public ParameterSampler(ParameterBox box, long seed) {
        this(box.lows(), box.highs(), seed);
    }

    /**
     * Samples of any box given as its lower and upper ends (the order-n {@link CompanionBox}: one parameter per
     * entry, in the caller's order, drawn in that order).
     */
    ParameterSampler(double[] lows, double[] highs, long seed) {
        if (lows.length != highs.length) {
            throw new IllegalArgumentException("one upper end per lower end");
        }
        this.lows = lows.clone();
        this.highs = highs.clone();
        this.random = new SplittableRandom(seed);
    }

    /** The next sample, one value per parameter ({a0, a1, b, d} for a {@link ParameterBox}). */
    public double[] next() {
        double[] p = new double[lows.length];
        for (int i = 0; i < p.length; i++) {
            p[i] = lows[i] + (highs[i] - lows[i]) * random.nextDouble();
        }
        return p;
    }
}
