package com.loopwright.solver.design;

/**
 * The state-feedback law run by a controller once per sample period, by emulation: the continuous gains are
 * used unchanged, the measurement is sampled and the command held (zero-order hold) until the next sample:
 * u[k] = clamp(kr r[k] - (k1 x1[k] + k2 x2[k]), commandMin, commandMax).
 *
 * @param samplePeriod    T [s]
 * @param positionGain           k1 [u per x1 unit]
 * @param velocityGain           k2 [u per x2 unit]
 * @param referenceGain          kr, the setpoint feedforward [u per x1 unit] (unit DC gain from r to x1)
 * @param commandMin             lowest command the actuator takes [u units]
 * @param commandMax             highest command the actuator takes, above commandMin [u units]
 * @param sampledSpectralRadius  largest |eigenvalue| of Ad - Bd K, the unclamped sampled loop (&lt; 1: stable)
 * @param periodPerTimeConstant  wn T, the sample period in units of the closed-loop time scale 1/wn
 */
public record SampledLaw(
        double samplePeriod,
        double positionGain,
        double velocityGain,
        double referenceGain,
        double commandMin,
        double commandMax,
        double sampledSpectralRadius,
        double periodPerTimeConstant) {

    /** u for one sample, clamped to [commandMin, commandMax]. */
    public double command(double setpoint, double position, double velocity) {
        double unclamped = referenceGain * setpoint - (positionGain * position + velocityGain * velocity);
        return Math.max(commandMin, Math.min(commandMax, unclamped));
    }
}
