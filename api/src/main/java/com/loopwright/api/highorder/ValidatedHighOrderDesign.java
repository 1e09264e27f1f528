package com.loopwright.api.highorder;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.DesignSpec;

/**
 * A high-order request that passed validation, in solver types; {@code loop} is null for today's plain full-state
 * loop; {@code robust} is null without a box.
 */
public record ValidatedHighOrderDesign(
        CompanionPlant plant,
        DesignSpec spec,
        AuxiliaryPlacement auxiliary,
        boolean matchSpecs,
        GammaChoice gammaChoice,
        double stepSize,
        double bandFraction,
        double maxUndershootPercent,
        StateSpace stateSpace,
        com.loopwright.api.loop.ValidatedLoop loop,
        ValidatedHighOrderRobust robust) {

    /** The state space as sent (null for a companion-form request), to be transformed. */
    public record StateSpace(
            org.ejml.data.DMatrixRMaj a,
            org.ejml.data.DMatrixRMaj b2,
            org.ejml.data.DMatrixRMaj b1,
            org.ejml.data.DMatrixRMaj output) {
        public StateSpace {
            a = a.copy();
            b2 = b2.copy();
            b1 = b1.copy();
            output = output.copy();
        }

        @Override
        public org.ejml.data.DMatrixRMaj a() {
            return a.copy();
        }

        @Override
        public org.ejml.data.DMatrixRMaj b2() {
            return b2.copy();
        }

        @Override
        public org.ejml.data.DMatrixRMaj b1() {
            return b1.copy();
        }

        @Override
        public org.ejml.data.DMatrixRMaj output() {
            return output.copy();
        }
    }
}
