package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;

/**
 * The loop implemented with a sampler and hold.
 *
 * @param samplePeriod       Ts
 * @param spectralRadius            max |z| of the emulated sampled loop Ad - Bd K (stable iff below 1)
 * @param emulated                  metrics with the continuous gains run at Ts (between samples); null when the
 *                                  simulation diverges
 * @param emulatedMeetsSpec         emulated metrics against the acceptance limits (NOT_JUDGED without limits)
 * @param directGains               gains of the direct discrete design (pole matching z = e^(lambda Ts))
 * @param direct                    metrics with the direct discrete gains
 * @param directMeetsSpec           direct metrics meet the acceptance limits
 * @param longestPeriodSeconds      longest Ts meeting the limits with the emulated gains (null if not searched or
 *                                  none found)
 * @param longestPeriodIsLowerBound true when even the search's largest Ts met the limits
 * @param searchEvaluations         simulations spent in the search
 * @param trajectory                the emulated step
 */
public record SampledReport(
        double samplePeriod,
        double spectralRadius,
        GridMetrics emulated,
        Verdict emulatedMeetsSpec,
        FeedbackGains directGains,
        GridMetrics direct,
        Verdict directMeetsSpec,
        Double longestPeriodSeconds,
        boolean longestPeriodIsLowerBound,
        int searchEvaluations,
        DenseTrajectory trajectory) {}
