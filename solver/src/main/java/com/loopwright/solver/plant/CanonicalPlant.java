package com.loopwright.solver.plant;

/**
 * Second-order plant in the form the design works in:
 * <pre>
 *   x1' = x2
 *   x2' = -a0 x1 - a1 x2 + b u + d w
 * </pre>
 * x1 is position-like, x2 velocity-like, u the actuator command, w the disturbance.
 *
 * @param a0 stiffness coefficient [1/s^2] (negative for an unstable plant)
 * @param a1 damping coefficient [1/s] (negative for negative damping)
 * @param b  actuator input gain [x1 units /(s^2 * u units)], non-zero
 * @param d  disturbance input gain [x1 units /(s^2 * w units)], zero when there is no disturbance channel
 */
public record CanonicalPlant(double a0, double a1, double b, double d) {

    public CanonicalPlant {
        if (!Double.isFinite(a0) || !Double.isFinite(a1) || !Double.isFinite(b) || !Double.isFinite(d)) {
            throw new IllegalArgumentException("plant coefficients must be finite");
        }
        if (b == 0) {
            throw new IllegalArgumentException("actuator gain b must be non-zero");
        }
    }
}
