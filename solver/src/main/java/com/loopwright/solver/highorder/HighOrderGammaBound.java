package com.loopwright.solver.highorder;

/**
 * One lower bound on gamma, found by bisection.
 *
 * @param condition       the requirement
 * @param stateIndex      1-based state index for {@link HighOrderCondition#WEIGHT_REAL}, 0 otherwise
 * @param gammaLowerBound the requirement holds for every gamma above this [w-to-z gain]; 0 if it held at every
 *                        gamma tried
 * @param binding         true when this bound is gamma_min
 */
public record HighOrderGammaBound(HighOrderCondition condition, int stateIndex, double gammaLowerBound,
                                  boolean binding) {

    public String meaning() {
        return condition.meaning(stateIndex);
    }
}
