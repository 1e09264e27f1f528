package com.loopwright.api.designspace;

import com.loopwright.solver.design.DesignSpaceGrid;
import com.loopwright.solver.pipeline.DesignSpaceOptions;
import com.loopwright.solver.plant.CanonicalPlant;

/**
 * A design-space request after validation, in solver terms.
 *
 * @param plant            the canonical plant
 * @param grid             the grid
 * @param options          actuator limit, sample period, step, box
 * @param specTimeSeconds  the spec to mark, or null
 * @param specOvershootPercent its overshoot, or null
 */
public record ValidatedDesignSpace(
        CanonicalPlant plant,
        DesignSpaceGrid grid,
        DesignSpaceOptions options,
        Double specTimeSeconds,
        Double specOvershootPercent) {

    /** The wire name of the time axis: settlingTime or riseTime. */
    public String timeName() {
        return grid.settlingAxis() ? "settlingTime" : "riseTime";
    }
}
