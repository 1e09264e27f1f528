package com.loopwright.solver.robustness;

import com.loopwright.solver.plant.CanonicalPlant;

/**
 * One evaluated parameter set.
 *
 * @param plant               the parameters
 * @param corner              true for a corner of the box, false for a Monte Carlo sample
 * @param stable              the closed loop with the nominal gains is stable for these parameters
 * @param settlingTimeSeconds exact settling time (null if unstable or not measurable)
 * @param riseTimeSeconds     exact 10-90% rise time (null if unstable or not measurable)
 * @param overshootPercent    exact overshoot (null if unstable or not measurable)
 * @param peakControl         exact max |u| (null if unstable or not measurable)
 * @param disturbanceGain     H-infinity norm from w to the performance output (null if unstable or not computed)
 * @param meetsSpec           meets the acceptance limits (false when unstable)
 */
public record UncertainCase(
        CanonicalPlant plant,
        boolean corner,
        boolean stable,
        Double settlingTimeSeconds,
        Double riseTimeSeconds,
        Double overshootPercent,
        Double peakControl,
        Double disturbanceGain,
        boolean meetsSpec) {}
