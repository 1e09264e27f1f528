package com.loopwright.api.design;

import com.loopwright.api.plant.PlantInput;
import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.validation.SpecInput;

/**
 * Body of POST /v1/designs.
 *
 * @param verify optional robustness checks of the designed loop; absent means the design response as before
 */
public record DesignRequest(PlantInput plant, SpecInput spec, VerifyInput verify) {

    /** A request without robustness checks. */
    public DesignRequest(PlantInput plant, SpecInput spec) {
        this(plant, spec, null);
    }
}
