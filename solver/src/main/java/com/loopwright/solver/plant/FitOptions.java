package com.loopwright.solver.plant;

/**
 * Which optional parameters the fit estimates.
 *
 * @param estimateDeadTime      fit a dead time between the step and the response (otherwise 0)
 * @param estimateInitialOffset fit the output's value before the step (otherwise 0: the samples are already
 *                              deviations from the operating point)
 */
public record FitOptions(boolean estimateDeadTime, boolean estimateInitialOffset) {}
