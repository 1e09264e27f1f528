package com.loopwright.solver.design;

/**
 * What the observer costs, computed on the full output-feedback loop (plant + observer + law). None of these is
 * covered by the state-feedback certificate: the norm from w to z may exceed gamma.
 *
 * @param disturbanceToPerformanceNorm the closed-loop H-infinity norm from w to z of the full loop
 * @param exceedsGamma                 true when that norm is above the design's gamma
 * @param margins                      margins at the plant input of the full loop
 * @param noiseToCommandGain           the H-infinity norm from measurement noise to the command u
 * @param step                         the full loop's reference step metrics
 * @param largestStepDifference        max over the samples of |y_full - y_state_feedback| for the same step
 */
public record OutputFeedbackFigures(
        HInfinityNorm disturbanceToPerformanceNorm,
        boolean exceedsGamma,
        PlantInputMargins margins,
        HInfinityNorm noiseToCommandGain,
        StepMetrics step,
        double largestStepDifference) {}
