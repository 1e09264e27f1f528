package com.loopwright.solver.spec;

/**
 * Exact relation between percent overshoot and damping ratio of the standard second-order step response
 * wn^2/(s^2 + 2 zeta wn s + wn^2):
 * <pre>
 *   OS = exp(-pi zeta / sqrt(1 - zeta^2)),   zeta = -ln(OS) / sqrt(pi^2 + ln(OS)^2)
 * </pre>
 * OS is a fraction in (0, 1); zeta in (0, 1).
 */
public final class OvershootDamping {

    private OvershootDamping() {}

    /** Damping ratio that gives exactly the overshoot fraction {@code overshoot} in (0, 1). */
    public static double dampingRatio(double overshoot) {
        if (!(overshoot > 0 && overshoot < 1)) {
            throw new IllegalArgumentException("overshoot fraction must lie in (0, 1): " + overshoot);
        }
        double logOs = Math.log(overshoot);
        return -logOs / Math.hypot(Math.PI, logOs);
    }

    /** Overshoot fraction of the underdamped response with damping ratio zeta in [0, 1); 0 for zeta >= 1. */
    public static double overshoot(double dampingRatio) {
        if (!(dampingRatio >= 0)) {
            throw new IllegalArgumentException("damping ratio must be non-negative: " + dampingRatio);
        }
        if (dampingRatio >= 1) {
            return 0;
        }
        return Math.exp(-Math.PI * dampingRatio / Math.sqrt(1 - dampingRatio * dampingRatio));
    }
}
