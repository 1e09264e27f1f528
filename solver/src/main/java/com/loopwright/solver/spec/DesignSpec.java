package com.loopwright.solver.spec;

/**
 * Time-domain specs for the closed-loop step response.
 *
 * @param overshootFraction peak overshoot as a fraction of the final value, in (0, 1)
 * @param timeSpec          settling time to a band, or 10-90% rise time
 */
public record DesignSpec(double overshootFraction, TimeSpec timeSpec) {

    public DesignSpec {
        if (!(overshootFraction > 0 && overshootFraction < 1)) {
            throw new IllegalArgumentException("overshoot fraction must lie in (0, 1)");
        }
        if (timeSpec == null) {
            throw new IllegalArgumentException("a time spec is required");
        }
    }

    /** The same spec with another overshoot. */
    public DesignSpec withOvershoot(double fraction) {
        return new DesignSpec(fraction, timeSpec);
    }
}
