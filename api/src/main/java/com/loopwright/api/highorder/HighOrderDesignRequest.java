package com.loopwright.api.highorder;

import com.loopwright.api.loop.LoopInput;
import com.loopwright.api.loop.ObserverInput;
import java.util.List;

/**
 * Body of POST /v1/designs/high-order (nullable until validated).
 *
 * @param plant          the companion-form plant of order 2..8
 * @param spec           overshoot, settling time and design options
 * @param auxiliaryPoles where the n - 2 poles beyond the dominant pair go (default: real, 4 x its real part)
 * @param matchSpecs     true to adjust the dominant pair until the simulated loop meets the specs
 * @param integralAction       integrate the tracking error (see {@link LoopInput}); absent means false
 * @param integralPoleMultiple the integral pole as a multiple of the dominant real part
 * @param measurement          "fullState" (default) or "position" (the output row numerator is what is measured)
 * @param observer             how the unmeasured states are estimated (position only)
 * @param loadStepSize         the load step of the recovery figures
 * @param robust               the companion box the law must meet the spec over (null: the nominal design)
 */
public record HighOrderDesignRequest(
        HighOrderPlantInput plant,
        HighOrderSpecInput spec,
        AuxiliaryPolesInput auxiliaryPoles,
        Boolean matchSpecs,
        Boolean integralAction,
        Double integralPoleMultiple,
        String measurement,
        ObserverInput observer,
        Double loadStepSize,
        HighOrderRobustInput robust) {

    /** The loop-structure fields together. */
    public LoopInput loop() {
        return new LoopInput(integralAction, integralPoleMultiple, measurement, observer, loadStepSize);
    }

    /**
     * The plant in controllable canonical form, lowest power first.
     *
     * @param denominator a_0 .. a_{n-1} of s^n + a_{n-1} s^{n-1} + ... + a_0
     * @param numerator   c_0 .. c_{n-1} of the output y = c_0 z_1 + ... + c_{n-1} z_n (default [1, 0, ...])
     * @param b           input gain
     * @param disturbance disturbance input vector, one entry per state
     * @param stateSpace  instead of the four fields above: a controllable state space, transformed to companion form
     */
    public record HighOrderPlantInput(
            List<Double> denominator,
            List<Double> numerator,
            Double b,
            List<Double> disturbance,
            StateSpaceInput stateSpace) {}

    /**
     * x' = a x + b2 u + b1 w, y = output x.
     *
     * @param a      n x n state matrix, row by row
     * @param b2     control input vector
     * @param b1     disturbance input vector
     * @param output output row (default [1, 0, ...])
     */
    public record StateSpaceInput(List<List<Double>> a, List<Double> b2, List<Double> b1, List<Double> output) {}

    /** Specs and options; times in seconds, overshoot, band and undershoot in percent. */
    public record HighOrderSpecInput(
            Double settlingTime,
            Double overshootPercent,
            Double settlingBandPercent,
            Double gamma,
            Double gammaMargin,
            Double stepSize,
            Double maxUndershootPercent) {}

    /** Exactly one of a real-part multiple or an explicit list of n - 2 poles. */
    public record AuxiliaryPolesInput(Double realPartMultiple, List<PoleInput> poles) {}

    /** A pole re + j im [1/s]. */
    public record PoleInput(Double re, Double im) {}
}
