package com.loopwright.solver.spec;

/**
 * Exact normalized 10-90% rise time R(zeta) = wn tr of wn^2/(s^2 + 2 zeta wn s + wn^2): the difference of
 * the first crossings of 0.9 and 0.1, each found by root finding on the analytic step response.
 */
public final class NormalizedRiseTime {

    public static final double LOW_LEVEL = 0.1;
    public static final double HIGH_LEVEL = 0.9;

    private NormalizedRiseTime() {}

    public static double of(double dampingRatio) {
        return of(new NormalizedStepResponse(dampingRatio));
    }

    /** {@link #of(double)} of a response already built. */
    public static double of(NormalizedStepResponse response) {
        return MonotoneRise.crossing(response, HIGH_LEVEL) - MonotoneRise.crossing(response, LOW_LEVEL);
    }
}
