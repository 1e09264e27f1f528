package com.loopwright.solver.pipeline;

import com.loopwright.solver.frequency.BodeSeries;
import com.loopwright.solver.robustness.LoopMargins;

/**
 * The frequency response of a design's loop broken at the plant input, for a Bode figure.
 *
 * @param series          L(jw) on a log grid from lowRadPerSec to highRadPerSec
 * @param margins         the closed-form margins of the same loop (the ones the verification reports)
 * @param lowRadPerSec    the window's lower end: two decades below wn, or lower to show a marked crossover
 * @param highRadPerSec   the window's upper end
 */
public record BodeData(BodeSeries series, LoopMargins margins, double lowRadPerSec, double highRadPerSec) {
}
