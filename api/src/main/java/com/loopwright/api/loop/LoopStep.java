package com.loopwright.api.loop;

/**
 * A unit reference step of a loop (r -> y), simulated by the exact zero-order hold and refined between samples.
 *
 * @param riseTime          10-90 % rise time [s]
 * @param settlingTime      settling time to the band of the spec [s]
 * @param overshootPercent  overshoot [percent of the final value]
 * @param undershootPercent largest excursion opposite to the final value [percent]
 * @param peakTime          time of the largest output [s]
 * @param steadyStateError  1 minus the final value
 * @param peakControl       largest |u| over the step, per unit step
 */
public record LoopStep(
        double riseTime,
        double settlingTime,
        double overshootPercent,
        double undershootPercent,
        double peakTime,
        double steadyStateError,
        double peakControl) {}
