package com.loopwright.api.highorder;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.design.RobustDesign;
import com.loopwright.api.robustness.RobustnessResponse;
import java.util.List;

/**
 * The robust member of a high-order response, in the shape of the order-2 robust member (RobustDesign) with the
 * perturbed companion plant for a case: the dominant pair chosen so that the order-n law meets the spec on every
 * corner and Monte Carlo sample of the box, how it was found, and what the robustness costs.
 *
 * @param selectionRule     leastBandwidth: the smallest natural frequency whose every case meets the limits
 * @param nominalTarget     the chosen dominant pair (the design's target)
 * @param requestedTarget   the exact inversion of the requested spec
 * @param cornerCount       corners of the box
 * @param monteCarloSamples seeded samples inside it
 * @param seed              their seed
 * @param evaluations       order-n designs computed by the search
 * @param caseEvaluations   simulated steps computed by the search
 * @param meetsEverywhere   every corner and sample meets the limits (and the actuator limit) with the nominal law
 * @param worstCase         the case and metric closest to its limit (absent when no case is measured)
 * @param priceOfRobustness the nominal loop against the spec requested, and the worst case
 * @param actuatorLimit     the bound every case's max |u| meets, or absent
 * @param gamma             the bound each corner's norm is compared with: the design's gamma, the augmented
 *                          design's with integral action
 * @param corners           each corner's metrics and certified H-infinity norm from w to z
 * @param judgedLoop        integralAction, positionObserver or integralActionPositionObserver: the loop judged over
 *                          the box (the nominal law and observer on each perturbed plant), absent for the full-state
 *                          law
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record HighOrderRobustDesign(
        String selectionRule,
        RobustDesign.TargetPoint nominalTarget,
        RobustDesign.TargetPoint requestedTarget,
        int cornerCount,
        int monteCarloSamples,
        long seed,
        int evaluations,
        long caseEvaluations,
        boolean meetsEverywhere,
        WorstCase worstCase,
        RobustDesign.Price priceOfRobustness,
        Double actuatorLimit,
        double gamma,
        List<Corner> corners,
        String judgedLoop) {

    public HighOrderRobustDesign {
        corners = List.copyOf(corners);
    }

    /**
     * A perturbed companion plant: its denominator as plant.denominator on the wire ([1, a_{n-1}, ..., a_0],
     * highest power first) and its input gain; the numerator and disturbance are the nominal ones.
     */
    public record CasePlant(List<Double> denominator, double b) {
        public CasePlant {
            denominator = List.copyOf(denominator);
        }
    }

    /**
     * @param plant         the parameters of the case
     * @param bindingMetric settlingTime, overshootPercent or peakControl: the metric closest to its limit
     * @param ratioToLimit  the metric over its limit (at most 1 when every case meets the limits)
     * @param metrics       the case's step metrics
     */
    public record WorstCase(
            CasePlant plant, String bindingMetric, double ratioToLimit, RobustnessResponse.Metrics metrics) {}

    /**
     * @param plant         the corner
     * @param metrics       its step metrics with the nominal law
     * @param hInfinityNorm certified norm from w to z = [rho_1 z_1, ..., rho_n z_n, u] of the loop at this corner
     * @param withinGamma   hInfinityNorm &lt;= gamma
     */
    public record Corner(
            CasePlant plant, RobustnessResponse.Metrics metrics, double hInfinityNorm, boolean withinGamma) {}
}
