package com.loopwright.solver.robustness;

import java.util.OptionalDouble;

/**
 * The result of the search for the longest sample period that meets the acceptance limits with the emulated gains.
 *
 * @param periodSeconds  the longest Ts found to meet the limits; empty when not searched or none found
 * @param lowerBoundOnly true when even the search's largest Ts met the limits (the longest is at least this)
 * @param evaluations    simulations spent in the search
 */
record LongestSamplePeriod(OptionalDouble periodSeconds, boolean lowerBoundOnly, int evaluations) {

    static final LongestSamplePeriod NOT_SEARCHED = new LongestSamplePeriod(OptionalDouble.empty(), false, 0);
}
