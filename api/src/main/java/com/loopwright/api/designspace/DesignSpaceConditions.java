package com.loopwright.api.designspace;

import com.loopwright.api.result.GammaConditions;
import com.loopwright.solver.design.DesignSpaceLimit;
import com.loopwright.solver.design.GammaCondition;

/**
 * Wire names of why a cell fails: the gamma requirement's own name (GammaConditions), or the limit's field name
 * in the contract (actuatorLimit, samplePeriod), or one of the pole-match requirements.
 */
final class DesignSpaceConditions {

    private DesignSpaceConditions() {}

    static String wireName(DesignSpaceLimit limit, GammaCondition condition) {
        return switch (limit) {
            case STIFFNESS_ABOVE_PLANT -> "stiffnessAbovePlant";
            case DAMPING_ABOVE_PLANT -> "dampingAbovePlant";
            case GAMMA_CONDITION -> GammaConditions.wireName(condition);
            case ACTUATOR_LIMIT -> "actuatorLimit";
            case SAMPLE_PERIOD -> "samplePeriod";
            case GRID_EDGE -> "gridEdge";
        };
    }

    /** The 1-based state of a weightReal requirement, else null. */
    static Integer state(DesignSpaceLimit limit, GammaCondition condition) {
        if (limit != DesignSpaceLimit.GAMMA_CONDITION) {
            return null;
        }
        int state = GammaConditions.state(condition, 0);
        return state == 0 ? null : state;
    }

    static String meaning(DesignSpaceLimit limit, GammaCondition condition) {
        return switch (limit) {
            case STIFFNESS_ABOVE_PLANT ->
                "the loop must be stiffer than the plant: p12 = (wn^2 - a0)/b^2 > 0 (a faster time spec helps)";
            case DAMPING_ABOVE_PLANT ->
                "the loop must be more damped than the plant: p22 = (2 zeta wn - a1)/b^2 > 0 (a faster time spec"
                        + " helps)";
            case GAMMA_CONDITION -> "fails for every gamma: " + condition.meaning();
            case ACTUATOR_LIMIT -> "the peak command of the step exceeds actuatorLimit";
            case SAMPLE_PERIOD ->
                "the law sampled at samplePeriod fails the controller export's test (wn T <= 0.5 and the sampled"
                        + " loop stable)";
            case GRID_EDGE -> "the grid's fastest time is feasible: a faster spec may be too";
        };
    }
}
