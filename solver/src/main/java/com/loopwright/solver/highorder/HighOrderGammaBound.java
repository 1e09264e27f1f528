package com.loopwright.solver.highorder;

/**
 * One requirement's lower bound on gamma. The requirements need not be monotone in gamma: the bound says where
 * the requirement stops holding for good as gamma decreases, not that it holds at every gamma above.
 *
 * @param condition       the requirement
 * @param stateIndex      1-based state index for {@link HighOrderCondition#WEIGHT_REAL}, 0 otherwise
 * @param gammaLowerBound the smallest gamma at which the requirement holds on the followed solution branches
 *                        [w-to-z gain]; below it the requirement fails there
 * @param binding         true when this requirement ends the feasible set at gamma_min
 */
public record HighOrderGammaBound(HighOrderCondition condition, int stateIndex, double gammaLowerBound,
                                  boolean binding) {

    public String meaning() {
        return condition.meaning(stateIndex);
    }
}
