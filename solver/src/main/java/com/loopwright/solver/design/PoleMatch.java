package com.loopwright.solver.design;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;

/**
 * The two entries of P that pole matching fixes. With B2 = [0, b]' the closed loop A - B2 B2' P has
 * characteristic polynomial s^2 + (a1 + b^2 p22) s + (a0 + b^2 p12); matching s^2 + 2 zeta wn s + wn^2 gives
 * <pre>
 *   p12 = (wn^2 - a0)/b^2,   p22 = (2 zeta wn - a1)/b^2.
 * </pre>
 */
public record PoleMatch(double p12, double p22) {

    public static PoleMatch of(CanonicalPlant plant, TargetDynamics target) {
        double wn = target.naturalFrequencyRadPerSec();
        double b2 = plant.b() * plant.b();
        return new PoleMatch((wn * wn - plant.a0()) / b2, (2 * target.dampingRatio() * wn - plant.a1()) / b2);
    }
}
