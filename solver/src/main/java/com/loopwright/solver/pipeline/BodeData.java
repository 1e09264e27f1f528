package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.BodeSeries;
import com.loopwright.solver.design.LoopMargins;

/**
 * The frequency response of a design's loop broken at the plant input, for a Bode figure: L(jw) on a log grid
 * from lowRadPerSec to highRadPerSec, with the margins of the same loop.
 *
 * @param series        L(j w_k) on the grid: frequency, magnitude in dB, phase unwrapped along the grid
 * @param margins       the closed-form margins of the same loop (the ones the verification reports)
 * @param lowRadPerSec  the window's lower end: two decades below wn, or lower to show a crossover
 * @param highRadPerSec the window's upper end
 */
public record BodeData(BodeSeries series, LoopMargins margins, double lowRadPerSec, double highRadPerSec) {}
