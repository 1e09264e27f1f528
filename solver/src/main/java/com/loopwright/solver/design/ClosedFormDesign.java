package com.loopwright.solver.design;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import java.util.OptionalDouble;

/**
 * The closed-form design: Riccati solution P = [[p11, p12], [p12, p22]], weights of z = [rho1 x1, rho2 x2, u],
 * the gamma bounds and the chosen gamma. The law is u = -B2'P x + r wn^2/b for a reference r.
 */
public record ClosedFormDesign(
        CanonicalPlant plant,
        TargetDynamics target,
        double p11,
        double p12,
        double p22,
        double rho1,
        double rho2,
        List<GammaBound> gammaBounds,
        double gammaMin,
        double gamma) {

    public ClosedFormDesign {
        gammaBounds = List.copyOf(gammaBounds);
    }

    /** Position gain k1 = b p12 [u per x1]. */
    public double positionGain() {
        return plant.b() * p12;
    }

    /** Velocity gain k2 = b p22 [u per x2]. */
    public double velocityGain() {
        return plant.b() * p22;
    }

    /** Reference gain kr = (a0 + b k1)/b = wn^2/b, which makes the DC gain from r to x1 exactly 1. */
    public double referenceGain() {
        double wn = target.naturalFrequencyRadPerSec();
        return wn * wn / plant.b();
    }

    /** k = b^2 - d^2/gamma^2, the net curvature of the Riccati quadratic term (b^2 when d = 0). */
    public double riccatiCurvature() {
        return ClosedFormDesigner.curvature(plant, gamma);
    }

    /**
     * Certified L2 gain from disturbance to position, gamma/rho1: ||x1||_2 &lt;= (gamma/rho1) ||w||_2.
     * Empty when rho1 = 0 (no position weight, no such certificate).
     */
    public OptionalDouble positionPerDisturbanceBound() {
        return rho1 > 0 ? OptionalDouble.of(gamma / rho1) : OptionalDouble.empty();
    }

    /**
     * The gamma that minimizes gamma/rho1. With c = 2 a0 p12 + b^2 p12^2, rho1^2 = c - d^2 p12^2/gamma^2, and
     * gamma^2/rho1^2 = u^2/(c u - d^2 p12^2) with u = gamma^2 is least at u = 2 d^2 p12^2 / c. Empty when that
     * point is not above gamma_min (then the certificate improves all the way down to gamma_min) or d = 0.
     */
    public OptionalDouble positionCertificateBestGamma() {
        double c = 2 * plant.a0() * p12 + plant.b() * plant.b() * p12 * p12;
        if (plant.d() == 0 || !(c > 0)) {
            return OptionalDouble.empty();
        }
        double best = Math.sqrt(2 * plant.d() * plant.d() * p12 * p12 / c);
        return best > gammaMin ? OptionalDouble.of(best) : OptionalDouble.empty();
    }
}
