package com.loopwright.solver.spec;

import java.util.List;

/**
 * The closed-loop dynamics the specs demand: characteristic polynomial s^2 + 2 zeta wn s + wn^2.
 *
 * @param dampingRatio              zeta, dimensionless, &gt; 0
 * @param naturalFrequencyRadPerSec wn [rad/s], &gt; 0
 */
public record TargetDynamics(double dampingRatio, double naturalFrequencyRadPerSec) {

    public TargetDynamics {
        if (!(dampingRatio > 0) || !Double.isFinite(dampingRatio)) {
            throw new IllegalArgumentException("damping ratio must be positive and finite");
        }
        if (!(naturalFrequencyRadPerSec > 0) || !Double.isFinite(naturalFrequencyRadPerSec)) {
            throw new IllegalArgumentException("natural frequency must be positive and finite");
        }
    }

    /** Real part of both poles for zeta &lt; 1: -zeta wn [1/s]. */
    public double poleRealPart() {
        return dampingRatio < 1
                ? -dampingRatio * naturalFrequencyRadPerSec
                : -naturalFrequencyRadPerSec * (dampingRatio - Math.sqrt(dampingRatio * dampingRatio - 1));
    }

    /** The two closed-loop poles, the complex pair -zeta wn +- j wn sqrt(1 - zeta^2), or two real poles. */
    public List<Pole> poles() {
        double zeta = dampingRatio;
        double wn = naturalFrequencyRadPerSec;
        if (zeta < 1) {
            double im = wn * Math.sqrt(1 - zeta * zeta);
            return List.of(new Pole(-zeta * wn, im), new Pole(-zeta * wn, -im));
        }
        double root = wn * Math.sqrt(zeta * zeta - 1);
        return List.of(new Pole(-zeta * wn + root, 0), new Pole(-zeta * wn - root, 0));
    }

    /** Peak time of the step response, pi / (wn sqrt(1 - zeta^2)) [s], for zeta &lt; 1. */
    public double peakTimeSeconds() {
        return Math.PI / (naturalFrequencyRadPerSec * Math.sqrt(1 - dampingRatio * dampingRatio));
    }

    /** A pole re + j im [1/s]. */
    public record Pole(double re, double im) {}
}
