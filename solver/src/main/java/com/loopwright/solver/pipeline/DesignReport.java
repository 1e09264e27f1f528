package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.Verification;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.SpecInversion;

/**
 * Everything one design produced.
 *
 * @param horizonSeconds simulated time
 * @param samples        simulation grid size
 */
public record DesignReport(
        DesignSpec spec,
        SpecInversion inversion,
        ClosedFormDesign design,
        Verification verification,
        double stepSize,
        double bandFraction,
        double horizonSeconds,
        int samples) {

    /** The simulated step metrics of the verification. */
    public StepMetrics stepMetrics() {
        return verification.metrics();
    }

    /** The numeric Riccati solution that cross-checks the closed-form P, with its agreement. */
    public NumericRiccati numericRiccati() {
        RiccatiSolution numeric = verification.numeric();
        return new NumericRiccati(
                numeric.p().get(0, 0),
                numeric.p().get(0, 1),
                numeric.p().get(1, 1),
                numeric.relativeResidual(),
                verification.relativeDifference(),
                numeric.iterations());
    }
}
