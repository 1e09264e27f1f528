package com.loopwright.api.verification;

/**
 * Gains of u = kr r + ki xi - (k1 x1 + k2 x2), xi' = r - x1, the caller already has.
 *
 * @param integralGain ki on the integral of the tracking error; absent: no integrator
 */
public record GainInput(Double k1, Double k2, Double referenceGain, Double integralGain) {

    /** Gains without an integrator. */
    public GainInput(Double k1, Double k2, Double referenceGain) {
        this(k1, k2, referenceGain, null);
    }
}
