package com.loopwright.api.plant;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.PlantForm;
import java.util.List;

/**
 * A plant description after validation and conversion.
 *
 * @param form        which description the caller used
 * @param canonical   the canonical coefficients the design works in
 * @param source      the converted description (null for the canonical form)
 * @param assumptions what was assumed in the conversion, in words (for example where the disturbance enters)
 * @param notation    how the form names the canonical states, command and disturbance
 */
public record ResolvedPlant(
        PlantFormName form,
        CanonicalPlant canonical,
        PlantForm source,
        List<String> assumptions,
        PlantNotation notation) {

    public ResolvedPlant {
        assumptions = List.copyOf(assumptions);
    }

    public static ResolvedPlant canonical(CanonicalPlant plant) {
        return new ResolvedPlant(PlantFormName.CANONICAL, plant, null, List.of(), CanonicalPlantInput.NOTATION);
    }
}
