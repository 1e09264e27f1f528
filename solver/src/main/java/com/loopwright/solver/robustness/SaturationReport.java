package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.GridMetrics;

/**
 * The reference step with an actuator limit.
 *
 * @param limit                  |u| limit, u units
 * @param unsaturatedPeakControl exact max |u| of the linear loop for the step
 * @param saturates              unsaturatedPeakControl &gt; limit
 * @param largestUnsaturatedStep largest |step| that stays within the limit: limit |step| / peak (peak |u| is
 *                               linear in the step size); null when the loop never uses u
 * @param diverged               the saturated simulation overflowed (the limit cannot hold the loop)
 * @param metrics                step metrics with saturation; null when it diverged
 * @param meetsSpec              the saturated step against the acceptance limits (NOT_JUDGED without limits)
 * @param trajectory             the saturated step
 */
public record SaturationReport(
        double limit,
        double unsaturatedPeakControl,
        boolean saturates,
        Double largestUnsaturatedStep,
        boolean diverged,
        GridMetrics metrics,
        Verdict meetsSpec,
        DenseTrajectory trajectory) {}
