package com.loopwright.solver.design;

/**
 * Stability margins of a loop of any order broken at the plant input, L(s) = -(command)/(plant input) with the
 * controller's own states (integrator, observer) inside L. Gain and phase crossovers are found on a dense log grid
 * and refined by bisection; the field names follow {@link LoopMargins}.
 *
 * @param crossoverRadPerSec       the gain crossover that sets the phase margin, null without one
 * @param phaseMarginDegrees       min over gain crossovers of (180 + arg L) mod 360, null without a crossover
 * @param delayMarginSeconds       min over gain crossovers of lag / w, null without a crossover
 * @param gainMargin               1/|L| at the phase crossover with |L| &lt; 1 nearest instability, null if none
 * @param gainMarginRadPerSec      where, null without a gain margin
 * @param gainReductionMargin      1/|L| at a phase crossover with |L| &gt; 1 (below 1), null if none
 * @param peakSensitivity          max over the grid of |1/(1 + L(jw))|
 * @param peakSensitivityRadPerSec where
 * @param closedLoopStable         every closed-loop pole in the open left half plane
 * @param gridPoints               frequencies evaluated on the grid
 */
public record PlantInputMargins(
        Double crossoverRadPerSec,
        Double phaseMarginDegrees,
        Double delayMarginSeconds,
        Double gainMargin,
        Double gainMarginRadPerSec,
        Double gainReductionMargin,
        double peakSensitivity,
        double peakSensitivityRadPerSec,
        boolean closedLoopStable,
        int gridPoints) {}
