package com.loopwright.api.result;

import com.loopwright.solver.design.GammaBound;
import com.loopwright.solver.design.GammaCondition;

/** Wire names of the gamma requirements: one camelCase name per requirement, the same for every order. */
public final class GammaConditions {

    private GammaConditions() {}

    /** The wire name; the order-2 position and velocity weights are weightReal of states 1 and 2. */
    public static String wireName(GammaCondition condition) {
        return switch (condition) {
            case POSITION_WEIGHT_REAL, VELOCITY_WEIGHT_REAL, WEIGHT_REAL -> "weightReal";
            case P11_POSITIVE -> "p11Positive";
            case P_POSITIVE_DEFINITE -> "positiveDefinite";
            case STABILIZING_DAMPING -> "stabilizingDamping";
            case STABILIZING_STIFFNESS -> "stabilizingStiffness";
            case STABILIZING -> "stabilizing";
            case INPUT_GAIN -> "inputGain";
            case SOLUTION_BRANCH_END -> "solutionBranchEnd";
        };
    }

    /** The 1-based state a requirement is about (order 2: position 1, velocity 2), else 0. */
    public static int state(GammaCondition condition, int stateIndex) {
        return switch (condition) {
            case POSITION_WEIGHT_REAL -> 1;
            case VELOCITY_WEIGHT_REAL -> 2;
            default -> stateIndex;
        };
    }

    /** A solver bound to its wire record. */
    public static com.loopwright.api.result.GammaBound toWire(GammaBound bound) {
        return new com.loopwright.api.result.GammaBound(
                wireName(bound.condition()),
                state(bound.condition(), bound.stateIndex()),
                bound.meaning(),
                bound.gammaLowerBound(),
                bound.binding());
    }
}
