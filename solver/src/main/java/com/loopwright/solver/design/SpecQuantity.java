package com.loopwright.solver.design;

/** The spec quantity an infeasibility is blamed on, or a proposal changes. */
public enum SpecQuantity {
    OVERSHOOT_PERCENT,
    /** The settling time or the rise time, whichever the spec gives. */
    TIME_SPEC,
    GAMMA
}
