package com.loopwright.solver.design;

import com.loopwright.solver.spec.TargetDynamics;

/**
 * The dominant pair after spec matching.
 *
 * @param target                the matched dominant pair
 * @param startingTarget        the pair from the second-order formulas, where the iteration started
 * @param iterations            Newton iterations taken
 * @param settlingResidual      simulated settling time / spec - 1
 * @param overshootResidualPoints simulated overshoot - spec [percentage points]
 * @param step                  the simulated step at the matched pair
 */
public record SpecMatch(
        TargetDynamics target,
        TargetDynamics startingTarget,
        int iterations,
        double settlingResidual,
        double overshootResidualPoints,
        HighOrderStep step) {}
