package com.loopwright.solver.design;

/**
 * The law that runs on the plant: u = kr r + ki xi - K x_hat, with xi' = r - y the integral of the tracking error
 * (ki = 0 and no xi without integral action) and x_hat the plant state (measured, or estimated by an observer).
 *
 * @param stateGain            K on the plant state, one entry per state (companion coordinates)
 * @param integralGain         ki, 0 without integral action
 * @param referenceGain        kr: with integral action kr = ki / (-p_i), whose zero cancels the integral pole p_i
 *                             (two-degree-of-freedom reference shaping); without it the unit-DC-gain scale
 * @param integralPoleRadPerSec the real integral pole p_i [1/s] (negative), null without integral action
 */
public record TrackingLaw(double[] stateGain, double integralGain, double referenceGain, Double integralPoleRadPerSec) {

    public TrackingLaw {
        stateGain = stateGain.clone();
    }

    @Override
    public double[] stateGain() {
        return stateGain.clone();
    }

    /** True when the law integrates the tracking error. */
    public boolean integralAction() {
        return integralPoleRadPerSec != null;
    }
}
