package com.loopwright.solver.simulation;

/**
 * Thrown when a step metric is not determined within the simulated horizon: the output never
 * reaches 90% of its final value, or is still outside the settling band at the horizon. A longer
 * horizon fixes it (the loop is stable whenever metrics are computed), so this is a bad-argument
 * error rather than a number that would mislead.
 */
public final class HorizonTooShortException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    private final double horizonSeconds;

    public HorizonTooShortException(String message, double horizonSeconds) {
        super(message + " (horizon " + horizonSeconds + " s)");
        this.horizonSeconds = horizonSeconds;
    }

    /** The horizon that was too short, in seconds. */
    public double horizonSeconds() {
        return horizonSeconds;
    }
}
