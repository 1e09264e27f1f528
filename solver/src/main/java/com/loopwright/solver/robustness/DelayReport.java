package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.GridMetrics;

/**
 * The reference step with an input delay, simulated exactly in the sampled loop.
 *
 * @param delaySeconds         the delay
 * @param samplePeriod  sampling period of the simulation (the requested Ts, or a fine period)
 * @param delayMarginSeconds   continuous-loop delay margin (phase margin / crossover), null without a crossover
 * @param withinMargin         delay &lt; delay margin (NOT_JUDGED without a crossover)
 * @param diverges             the simulated state overflowed (the delayed loop is unstable)
 * @param metrics              step metrics with the delay (null when the loop diverges)
 * @param meetsSpec            the delayed step against the acceptance limits (NOT_JUDGED without limits)
 * @param trajectory           the delayed step (null when it diverges)
 */
public record DelayReport(
        double delaySeconds,
        double samplePeriod,
        Double delayMarginSeconds,
        Verdict withinMargin,
        boolean diverges,
        GridMetrics metrics,
        Verdict meetsSpec,
        DenseTrajectory trajectory) {}
