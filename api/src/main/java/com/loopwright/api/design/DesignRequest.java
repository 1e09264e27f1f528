package com.loopwright.api.design;

import com.loopwright.api.plant.PlantInput;
import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.validation.SpecInput;

/**
 * Body of POST /v1/designs.
 *
 * @param verify optional robustness checks of the designed loop; absent means the design response as before
 * @param robust optional robust design: the target is searched so that every case of the box meets the spec
 */
public record DesignRequest(PlantInput plant, SpecInput spec, VerifyInput verify, RobustInput robust) {

    /** A request without a robust design. */
    public DesignRequest(PlantInput plant, SpecInput spec, VerifyInput verify) {
        this(plant, spec, verify, null);
    }

    /** A request without robustness checks. */
    public DesignRequest(PlantInput plant, SpecInput spec) {
        this(plant, spec, null);
    }
}
