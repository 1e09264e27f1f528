package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.LoopMargins;

/**
 * The frequency response of a design's loop broken at the plant input, for a Bode figure: L(jw) on a log grid
 * from lowRadPerSec to highRadPerSec.
 *
 * @param angularFrequencyRadPerSec the grid w_k, ascending
 * @param magnitudeDecibels         20 log10 |L(j w_k)|
 * @param phaseDegrees              arg L(j w_k), unwrapped along the grid
 * @param margins                   the closed-form margins of the same loop (the ones the verification reports)
 * @param lowRadPerSec              the window's lower end: two decades below wn, or lower to show a crossover
 * @param highRadPerSec             the window's upper end
 */
public record BodeData(
        double[] angularFrequencyRadPerSec,
        double[] magnitudeDecibels,
        double[] phaseDegrees,
        LoopMargins margins,
        double lowRadPerSec,
        double highRadPerSec) {

    public BodeData {
        angularFrequencyRadPerSec = angularFrequencyRadPerSec.clone();
        magnitudeDecibels = magnitudeDecibels.clone();
        phaseDegrees = phaseDegrees.clone();
    }

    @Override
    public double[] angularFrequencyRadPerSec() {
        return angularFrequencyRadPerSec.clone();
    }

    @Override
    public double[] magnitudeDecibels() {
        return magnitudeDecibels.clone();
    }

    @Override
    public double[] phaseDegrees() {
        return phaseDegrees.clone();
    }

    /** Number of frequency points. */
    public int size() {
        return angularFrequencyRadPerSec.length;
    }
}
