package com.loopwright.api.design;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.robustness.RobustnessResponse;
import java.util.List;

/**
 * The robust member of a design response: the nominal target chosen so that every corner and Monte Carlo sample of
 * the box meets the spec, how it was found, and what the robustness costs.
 *
 * @param selectionRule     leastBandwidth: the smallest natural frequency whose every case meets the limits
 * @param nominalTarget     the chosen target (the design's target)
 * @param requestedTarget   the exact inversion of the requested spec
 * @param cornerCount       corners of the box
 * @param monteCarloSamples seeded samples inside it
 * @param seed              their seed
 * @param evaluations       targets evaluated by the search (each over the corners or over every case)
 * @param caseEvaluations   closed-form step metrics computed by the search
 * @param meetsEverywhere   every corner and sample meets the limits with the designed gains
 * @param worstCase         the case and metric closest to its limit
 * @param priceOfRobustness the nominal loop against the spec requested, and the worst case
 * @param actuatorLimit     the bound every case's max |u| meets, or absent
 * @param gamma             the design's gamma, the bound each corner's norm is compared with
 * @param corners           each corner's metrics and certified H-infinity norm from w to z (the continuous loop's
 *                          norm, also when the cases are judged sampled)
 * @param judgedLoop        the loop judged over the box when integral action, position-only sensing or a sample
 *                          period was asked (integralAction, positionObserver or integralActionPositionObserver:
 *                          every case a simulated step of that loop; with samplePeriod the same names prefixed
 *                          sampled, and sampledStateFeedback for the full-state law: every case the sampled loop
 *                          of the exported controller); absent for the full-state loop, judged in closed form
 * @param samplePeriod      the period every case was judged at [s] (the request's robust.samplePeriod), or absent
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record RobustDesign(
        String selectionRule,
        TargetPoint nominalTarget,
        TargetPoint requestedTarget,
        int cornerCount,
        int monteCarloSamples,
        long seed,
        int evaluations,
        long caseEvaluations,
        boolean meetsEverywhere,
        WorstCase worstCase,
        Price priceOfRobustness,
        Double actuatorLimit,
        double gamma,
        List<Corner> corners,
        String judgedLoop,
        Double samplePeriod) {

    public RobustDesign {
        corners = List.copyOf(corners);
    }

    /** A second-order target: damping ratio and natural frequency [rad/s]. */
    public record TargetPoint(double dampingRatio, double naturalFrequency) {}

    /**
     * @param plant        the parameters of the case
     * @param bindingMetric settlingTime, riseTime, overshootPercent or peakControl: the metric closest to its limit
     * @param ratioToLimit the metric over its limit (at most 1)
     * @param metrics      the case's step metrics
     */
    public record WorstCase(
            RobustnessResponse.PlantView plant,
            String bindingMetric,
            double ratioToLimit,
            RobustnessResponse.Metrics metrics) {}

    /**
     * @param requested              the spec as sent (the limits every case meets)
     * @param nominal                the nominal loop's simulated metrics
     * @param worst                  the largest of each metric over every case
     * @param naturalFrequencyRatio  nominal over requested natural frequency
     */
    public record Price(
            RobustnessResponse.Acceptance requested,
            RobustnessResponse.Metrics nominal,
            RobustnessResponse.Metrics worst,
            double naturalFrequencyRatio) {}

    /**
     * @param plant         the corner
     * @param metrics       its step metrics with the designed gains
     * @param hInfinityNorm certified norm from w to z = [rho1 x1, rho2 x2, u] at this corner
     * @param withinGamma   hInfinityNorm &lt;= gamma
     */
    public record Corner(
            RobustnessResponse.PlantView plant,
            RobustnessResponse.Metrics metrics,
            double hInfinityNorm,
            boolean withinGamma) {}
}
