package com.loopwright.solver.design;

/**
 * A state-feedback law u = kr r - (k1 x1 + k2 x2).
 *
 * @param positionGain  k1
 * @param velocityGain  k2
 * @param referenceGain kr
 */
public record FeedbackGains(double positionGain, double velocityGain, double referenceGain) {

    public FeedbackGains {
        if (!Double.isFinite(positionGain) || !Double.isFinite(velocityGain) || !Double.isFinite(referenceGain)) {
            throw new IllegalArgumentException("gains must be finite");
        }
    }
}
