package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.SpecInversion;
import com.loopwright.solver.verify.Verification;

/**
 * Everything one design produced.
 *
 * @param horizonSeconds simulated time
 * @param samples        simulation grid size
 */
public record DesignReport(DesignSpec spec, SpecInversion inversion, ClosedFormDesign design,
                           Verification verification, double stepSize, double bandFraction, double horizonSeconds,
                           int samples) {
}
