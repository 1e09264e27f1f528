package com.loopwright.api.result;

/**
 * Metrics of the simulated closed-loop step of size stepSize (the actual loop, zeros included).
 *
 * @param riseTime            10-90 % rise time [s]
 * @param settlingTime        settling time to the band [s]
 * @param overshootPercent    overshoot [percent of the final value]
 * @param undershootPercent   largest excursion opposite to the final value [percent of it]
 * @param peakTime            time of the largest output [s]
 * @param steadyStateError    reference minus final value, in output units
 * @param peakControl         largest |u| over the step, in u units
 * @param stepSize            the reference step
 * @param settlingBandPercent the settling band [percent]
 * @param horizon             simulated time [s]
 * @param samples             samples on the horizon
 */
public record Simulated(
        double riseTime,
        double settlingTime,
        double overshootPercent,
        double undershootPercent,
        double peakTime,
        double steadyStateError,
        double peakControl,
        double stepSize,
        double settlingBandPercent,
        double horizon,
        int samples) {}
