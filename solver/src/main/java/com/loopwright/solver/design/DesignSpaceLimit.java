package com.loopwright.solver.design;

/**
 * Why a cell of a design-space map has no usable design: the first requirement it fails, in the order they are
 * checked (pole match, the gamma requirements, the actuator limit, the sample period).
 */
public enum DesignSpaceLimit {
    /** p12 = (wn^2 - a0)/b^2 &gt; 0 fails: the spec asks for a loop no stiffer than the plant already is. */
    STIFFNESS_ABOVE_PLANT,
    /** p22 = (2 zeta wn - a1)/b^2 &gt; 0 fails: the spec asks for less damping than the plant already has. */
    DAMPING_ABOVE_PLANT,
    /** A gamma requirement no gamma can meet (the cell names which one). */
    GAMMA_CONDITION,
    /** The peak command of the step exceeds the actuator limit. */
    ACTUATOR_LIMIT,
    /** The emulated sampled loop at the sample period: wn T above the emulation limit, or not stable. */
    SAMPLE_PERIOD,
    /** The fastest feasible time lies at or below the grid's lowest time (only for a row's limit). */
    GRID_EDGE
}
