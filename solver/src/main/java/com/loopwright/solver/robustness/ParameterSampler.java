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
        this.lows = box.lows();
        this.highs = box.highs();
        this.random = new SplittableRandom(seed);
    }

    /** The next sample as {a0, a1, b, d}. */
    public double[] next() {
        double[] p = new double[4];
        for (int i = 0; i < 4; i++) {
            p[i] = lows[i] + (highs[i] - lows[i]) * random.nextDouble();
        }
        return p;
    }
}
