package com.loopwright.solver.designspace;

import com.loopwright.solver.plant.CanonicalPlant;
import java.util.List;

/**
 * What a map judges a cell by besides the gamma requirements.
 *
 * @param actuatorLimit     largest |u| the actuator gives, or null (not judged)
 * @param samplePeriod      period of the emulated sampled law [s], or null (not judged)
 * @param stepSize          the reference step the peak command is computed for
 * @param boxCases          the parameter sets of the box (corners first), empty without a box
 * @param toleranceFraction the cell's spec is widened by this fraction before a box case is judged
 */
public record MapConditions(
        Double actuatorLimit,
        Double samplePeriod,
        double stepSize,
        List<CanonicalPlant> boxCases,
        double toleranceFraction) {

    public MapConditions {
        boxCases = List.copyOf(boxCases);
    }
}
