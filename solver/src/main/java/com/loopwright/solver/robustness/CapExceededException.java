package com.loopwright.solver.robustness;

/**
 * A requested check would exceed one of the documented computation caps.
 *
 * @see #option()
 */
public final class CapExceededException extends IllegalArgumentException {

    /** Which request option is at fault, in solver terms. */
    public enum Option {
        SAMPLE_PERIOD,
        INPUT_DELAY,
        DISTURBANCE_TIMING
    }

    private final Option option;
    private final int index;

    public CapExceededException(Option option, int index, String message) {
        super(message);
        this.option = option;
        this.index = index;
    }

    public Option option() {
        return option;
    }

    /** Index of the offending list entry (disturbances), or -1. */
    public int index() {
        return index;
    }
}
