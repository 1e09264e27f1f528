package com.loopwright.api.request;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.highorder.AuxiliaryPlacement;
import com.loopwright.solver.highorder.CompanionPlant;
import com.loopwright.solver.spec.DesignSpec;

/** A high-order request that passed validation, in solver types. */
public record ValidatedHighOrderDesign(CompanionPlant plant, DesignSpec spec, AuxiliaryPlacement auxiliary,
                                       boolean matchSpecs, GammaChoice gammaChoice, double stepSize,
                                       double bandFraction, double maxUndershootPercent) {
}
