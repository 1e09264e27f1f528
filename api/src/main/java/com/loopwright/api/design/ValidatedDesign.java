package com.loopwright.api.design;

import com.loopwright.api.loop.ValidatedLoop;
import com.loopwright.api.plant.ResolvedPlant;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;

/**
 * A design request after validation, in solver terms.
 *
 * @param plant            canonical plant
 * @param spec             overshoot and time spec
 * @param gammaChoice      fixed gamma or margin over gamma_min
 * @param stepSize         reference step for the simulated check, in x1 units
 * @param bandFraction     settling band used for the simulated settling time
 * @param timeSpecPointer  JSON pointer of the time spec the caller gave (settlingTime or riseTime)
 * @param resolvedPlant    the caller's plant description and its conversion (canonical when not given)
 * @param loop             integral action and/or position-only sensing, or null for today's plain full-state loop
 */
public record ValidatedDesign(
        CanonicalPlant plant,
        DesignSpec spec,
        GammaChoice gammaChoice,
        double stepSize,
        double bandFraction,
        String timeSpecPointer,
        ResolvedPlant resolvedPlant,
        ValidatedLoop loop) {

    public ValidatedDesign {
        if (resolvedPlant == null) {
            resolvedPlant = ResolvedPlant.canonical(plant);
        }
    }

    /** A design of today's plain full-state loop. */
    public ValidatedDesign(
            CanonicalPlant plant,
            DesignSpec spec,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction,
            String timeSpecPointer,
            ResolvedPlant resolvedPlant) {
        this(plant, spec, gammaChoice, stepSize, bandFraction, timeSpecPointer, resolvedPlant, null);
    }

    /** A design of the canonical coefficients, without another plant description. */
    public ValidatedDesign(
            CanonicalPlant plant,
            DesignSpec spec,
            GammaChoice gammaChoice,
            double stepSize,
            double bandFraction,
            String timeSpecPointer) {
        this(plant, spec, gammaChoice, stepSize, bandFraction, timeSpecPointer, null, null);
    }
}
