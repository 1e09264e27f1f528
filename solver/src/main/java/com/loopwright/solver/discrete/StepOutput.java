package com.loopwright.solver.discrete;

/**
 * One sample's outputs.
 *
 * @param command        u, the command sent to the actuator [u units]
 * @param saturated      the clamp is active (the scaled, biased law output lies outside [uMin, uMax])
 * @param disabled       the enable input is false (the command is 0)
 * @param periodMismatch the measured task period differs from the design period by more than the tolerance
 */
public record StepOutput(double command, boolean saturated, boolean disabled, boolean periodMismatch) {

    /** Status bit of {@link #saturated}. */
    public static final int STATUS_SATURATED = 1;
    /** Status bit of {@link #disabled}. */
    public static final int STATUS_DISABLED = 2;
    /** Status bit of {@link #periodMismatch}. */
    public static final int STATUS_PERIOD_MISMATCH = 4;

    /** The status as the bit set the C export returns. */
    public int status() {
        return (saturated ? STATUS_SATURATED : 0)
                | (disabled ? STATUS_DISABLED : 0)
                | (periodMismatch ? STATUS_PERIOD_MISMATCH : 0);
    }
}
