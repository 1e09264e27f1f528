package com.loopwright.api.loop;

import com.fasterxml.jackson.annotation.JsonInclude;

/**
 * Margins of a loop of any order broken at the plant input, with the controller's own states (integrator,
 * observer) inside L(s). The names are those of the robustness margins; an unbounded gain margin is stated by
 * gainMarginUnbounded (JSON has no infinity).
 *
 * @param crossoverFrequency       |L| = 1 [rad/s], the crossover that sets the phase margin (absent without one)
 * @param phaseMargin              degrees, min over crossovers of (180 + arg L) mod 360
 * @param delayMargin              seconds, min over crossovers of that lag / w
 * @param gainMargin               1/|L| at the -180 deg crossing with |L| &lt; 1 (present only when bounded)
 * @param gainMarginUnbounded      true when no such crossing exists
 * @param gainMarginFrequency      where the gain margin is read [rad/s]
 * @param gainReductionMargin      factor (below 1) the loop gain may shrink to (absent: down to 0)
 * @param peakSensitivity          max |1/(1 + L)|
 * @param peakSensitivityFrequency where [rad/s]
 * @param closedLoopStable         every closed-loop pole in the open left half plane
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record InputMargins(
        Double crossoverFrequency,
        Double phaseMargin,
        Double delayMargin,
        Double gainMargin,
        boolean gainMarginUnbounded,
        Double gainMarginFrequency,
        Double gainReductionMargin,
        double peakSensitivity,
        double peakSensitivityFrequency,
        boolean closedLoopStable) {}
