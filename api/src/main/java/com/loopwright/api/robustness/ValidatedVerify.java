package com.loopwright.api.robustness;

import com.loopwright.solver.robustness.RobustnessOptions;

/**
 * Robustness options after validation.
 *
 * @param options          the solver options
 * @param toleranceFraction the spec is widened by this fraction of each limit before judging
 */
public record ValidatedVerify(RobustnessOptions options, double toleranceFraction) {}
