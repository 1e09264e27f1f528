package com.loopwright.api.loop;

/**
 * The loop-structure fields of a design request (order 2 and order n alike; nullable until validated).
 *
 * @param integralAction       true to integrate the tracking error (zero steady offset under a constant load)
 * @param integralPoleMultiple the real integral pole at this multiple of the dominant real part
 * @param measurement          "fullState" (default) or "position"
 * @param observer             how the unmeasured states are estimated (position only)
 * @param loadStepSize         the constant load w0 of the load-step figures [w units]
 */
public record LoopInput(
        Boolean integralAction,
        Double integralPoleMultiple,
        String measurement,
        ObserverInput observer,
        Double loadStepSize) {

    /** True when none of the fields is given: the request is today's plain design. */
    public boolean absent() {
        return integralAction == null
                && integralPoleMultiple == null
                && measurement == null
                && observer == null
                && loadStepSize == null;
    }
}
