package com.loopwright.solver.design;

/**
 * The simulated step of an order-n closed loop (highorder.ClosedLoopStep): metrics and sampled undershoot (largest excursion opposite to the final value, percent of it).
 *
 * @param metrics          rise, settling, overshoot, peak control
 * @param undershootPercent 100 max(0, -min y/y_inf), refined between samples (StepMetrics)
 * @param horizonSeconds   simulated window
 * @param samples          samples on it
 */
public record HighOrderStep(StepMetrics metrics, double undershootPercent, double horizonSeconds, int samples) {}
