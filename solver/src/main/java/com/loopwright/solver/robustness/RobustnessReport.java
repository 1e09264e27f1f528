package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.design.StepMetrics;
import java.util.List;

/**
 * Everything checked about one loop. Sections not requested are null (or empty).
 *
 * @param nominal           exact step metrics of the nominal continuous loop
 * @param nominalMeetsSpec  nominal metrics against the acceptance limits (NOT_JUDGED without limits)
 * @param horizonSeconds    simulated window of the nominal loop
 * @param hinfNorm          H-infinity norm from w to the performance output for the nominal plant
 * @param margins           frequency-domain margins and response
 * @param uncertainty       parameter uncertainty
 * @param disturbances      disturbance responses
 * @param saturation        actuator limit
 * @param sampled           sampled implementation
 * @param delay             input delay
 * @param nominalTrajectory the nominal step on the dense grid (for plots)
 */
public record RobustnessReport(
        StepMetrics nominal,
        Verdict nominalMeetsSpec,
        double horizonSeconds,
        double hinfNorm,
        LoopMargins margins,
        UncertaintyReport uncertainty,
        List<DisturbanceCheck> disturbances,
        SaturationReport saturation,
        SampledReport sampled,
        DelayReport delay,
        DenseTrajectory nominalTrajectory) {

    public RobustnessReport {
        disturbances = List.copyOf(disturbances);
    }
}
