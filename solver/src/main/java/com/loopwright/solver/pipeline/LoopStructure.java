package com.loopwright.solver.pipeline;

import com.loopwright.solver.integral.IntegralDesigner;

/**
 * How the loop is built around the plant.
 *
 * @param integralAction       integrate the tracking error (zero steady offset under a constant load)
 * @param integralPoleMultiple the real integral pole at this multiple of the dominant real part (ignored without
 *                             integral action)
 * @param measurement          what the sensors give
 * @param observer             how the unmeasured states are estimated; required for POSITION, null for FULL_STATE
 */
public record LoopStructure(
        boolean integralAction, double integralPoleMultiple, Measurement measurement, ObserverChoice observer) {

    /** What is measured. */
    public enum Measurement {
        /** Every plant state (position and velocity for the canonical plant). */
        FULL_STATE,
        /** The tracked output only (the position for the canonical plant; the output row for order n). */
        POSITION
    }

    public LoopStructure {
        if (measurement == null) {
            throw new IllegalArgumentException("the measurement must be given");
        }
        if (measurement == Measurement.POSITION && observer == null) {
            throw new IllegalArgumentException("position-only sensing needs an observer choice");
        }
        if (measurement == Measurement.FULL_STATE && observer != null) {
            throw new IllegalArgumentException("full-state sensing needs no observer");
        }
        if (integralAction && (!(integralPoleMultiple > 0) || !Double.isFinite(integralPoleMultiple))) {
            throw new IllegalArgumentException("the integral pole multiple must be positive and finite");
        }
    }

    /** Today's loop: full state, no integral action. */
    public static LoopStructure plain() {
        return new LoopStructure(false, IntegralDesigner.DEFAULT_INTEGRAL_POLE_MULTIPLE, Measurement.FULL_STATE, null);
    }

    /** Integral action with the default integral pole (4x the dominant real part), full state. */
    public static LoopStructure withIntegralAction() {
        return new LoopStructure(true, IntegralDesigner.DEFAULT_INTEGRAL_POLE_MULTIPLE, Measurement.FULL_STATE, null);
    }
}
