package com.loopwright.solver.robustness;

import java.util.List;

/**
 * Parameter uncertainty: every corner of the box plus seeded Monte Carlo samples, with the nominal gains.
 *
 * @param cornerCount          number of corners evaluated (2^varying)
 * @param sampleCount          number of Monte Carlo samples evaluated
 * @param seed                 the generator seed (same seed, same samples, bit for bit)
 * @param unstableCount        cases where the loop is unstable
 * @param meetingFraction      fraction of all cases that meet the acceptance limits (null if nothing is judged)
 * @param settlingTime         distribution of the settling time (null if no case was measured)
 * @param riseTime             distribution of the rise time
 * @param overshootPercent     distribution of the overshoot
 * @param peakControl          distribution of max |u|
 * @param disturbanceGain      distribution of the H-infinity norm w to z
 * @param worstCase            the case furthest from the limits (unstable first, then the largest ratio of a
 *                             metric to its limit); null when nothing is judged
 * @param cases                the corners, in binary order over (a0, a1, b, d) low/high
 */
public record UncertaintyReport(
        int cornerCount,
        int sampleCount,
        long seed,
        int unstableCount,
        Double meetingFraction,
        MetricSummary settlingTime,
        MetricSummary riseTime,
        MetricSummary overshootPercent,
        MetricSummary peakControl,
        MetricSummary disturbanceGain,
        UncertainCase worstCase,
        List<UncertainCase> cases) {

    public UncertaintyReport {
        cases = List.copyOf(cases);
    }
}
