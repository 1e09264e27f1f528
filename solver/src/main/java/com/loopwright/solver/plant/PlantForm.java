package com.loopwright.solver.plant;

/** A plant description that reduces to the canonical second-order form. */
public sealed interface PlantForm permits RotaryAxis, MassSpringDamper, SecondOrderTransferFunction, TwoStateModel {

    /** The canonical coefficients the design works in. */
    CanonicalPlant canonical();
}
