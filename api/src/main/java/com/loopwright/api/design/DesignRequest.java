package com.loopwright.api.design;

import com.loopwright.api.loop.LoopInput;
import com.loopwright.api.loop.ObserverInput;
import com.loopwright.api.plant.PlantInput;
import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.validation.SpecInput;

/**
 * Body of POST /v1/designs.
 *
 * @param verify               optional robustness checks of the designed loop; absent means the design response as
 *                             before
 * @param integralAction       integrate the tracking error (see {@link LoopInput}); absent means false
 * @param integralPoleMultiple the integral pole as a multiple of the dominant real part
 * @param measurement          "fullState" (default) or "position"
 * @param observer             how the unmeasured states are estimated (position only)
 * @param loadStepSize         the load step of the recovery figures
 * @param robust               optional robust design: the target is searched so that every case of the box meets
 *                             the spec
 */
public record DesignRequest(
        PlantInput plant,
        SpecInput spec,
        VerifyInput verify,
        Boolean integralAction,
        Double integralPoleMultiple,
        String measurement,
        ObserverInput observer,
        Double loadStepSize,
        RobustInput robust) {

    /** A request without robustness checks. */
    public DesignRequest(PlantInput plant, SpecInput spec) {
        this(plant, spec, null);
    }

    /** A request of today's plain full-state loop. */
    public DesignRequest(PlantInput plant, SpecInput spec, VerifyInput verify) {
        this(plant, spec, verify, null, null, null, null, null, null);
    }

    /** A request with the loop-structure fields and without a robust design. */
    public DesignRequest(
            PlantInput plant,
            SpecInput spec,
            VerifyInput verify,
            Boolean integralAction,
            Double integralPoleMultiple,
            String measurement,
            ObserverInput observer,
            Double loadStepSize) {
        this(plant, spec, verify, integralAction, integralPoleMultiple, measurement, observer, loadStepSize, null);
    }

    /** The loop-structure fields together. */
    public LoopInput loop() {
        return new LoopInput(integralAction, integralPoleMultiple, measurement, observer, loadStepSize);
    }
}
