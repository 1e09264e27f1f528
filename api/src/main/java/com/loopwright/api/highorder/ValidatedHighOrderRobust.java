package com.loopwright.api.highorder;

import com.loopwright.solver.robustness.CompanionBox;

/**
 * The robust member of a high-order request that passed validation.
 *
 * @param box           the companion box
 * @param samples       Monte Carlo samples
 * @param seed          their seed
 * @param actuatorLimit bound on every case's max |u|, or null
 */
public record ValidatedHighOrderRobust(CompanionBox box, int samples, long seed, Double actuatorLimit) {}
