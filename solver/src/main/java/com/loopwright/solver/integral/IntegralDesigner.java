package com.loopwright.solver.integral;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.highorder.HighOrderDesigner;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;

/**
 * Pole-matched H-infinity design of the augmented plant ({@link IntegralAugmentation}) by the order-n designer, and
 * the law on the original coordinates. The augmented gain [k0, K] acts on [z0, z] = [-xi / c0, z], so
 * u = -k0 z0 - K z = (k0 / c0) xi - K z: ki = k0 / c0. The closed loop has the plant's poles (dominant pair and the
 * plant's auxiliary poles) and the real integral pole p_i. From r, u = (kr + ki / s) r, a zero at -ki / kr; with
 * kr = ki / (-p_i) it sits on p_i and cancels it, so r -> y is the response of the plain design with the same
 * poles (for order 2 exactly wn^2/(s^2 + 2 zeta wn s + wn^2)): the constant term of the closed-loop polynomial is
 * b c0 ki = alpha_0 (-p_i), hence b c0 kr = alpha_0 and the DC gain is 1.
 */
public final class IntegralDesigner {

    /** The integral pole sits at this multiple of the dominant real part unless the caller says otherwise. */
    public static final double DEFAULT_INTEGRAL_POLE_MULTIPLE = DesiredPoles.DEFAULT_REAL_PART_MULTIPLE;

    private final HighOrderDesigner designer = new HighOrderDesigner();

    /** The augmented design and the law it gives. */
    public record IntegralDesign(HighOrderDesign augmented, TrackingLaw law) {}

    /**
     * @param plant            the plant, tracked output c0 z1
     * @param plantPoles       the closed-loop poles of the plain design (dominant pair and n - 2 auxiliary poles)
     * @param integralMultiple the integral pole at this multiple of the dominant real part, positive
     * @throws com.loopwright.solver.design.InfeasibleDesignException when no gamma completes the augmented design
     */
    public IntegralDesign design(
            CompanionPlant plant, DesiredPoles plantPoles, double integralMultiple, GammaChoice gammaChoice) {
        if (!(integralMultiple > 0) || !Double.isFinite(integralMultiple)) {
            throw new IllegalArgumentException("the integral pole multiple must be positive and finite");
        }
        CompanionPlant augmented = IntegralAugmentation.augment(plant);
        TargetDynamics dominant = plantPoles.dominant();
        double integralPole = integralMultiple * dominant.poleRealPart();
        List<TargetDynamics.Pole> auxiliary = new ArrayList<>(plantPoles.auxiliary());
        auxiliary.add(new TargetDynamics.Pole(integralPole, 0));
        HighOrderDesign design = designer.design(augmented, new DesiredPoles(dominant, auxiliary), gammaChoice);
        double[] k = design.gain();
        double c0 = plant.numerator()[0];
        double ki = k[0] / c0;
        double[] stateGain = new double[plant.order()];
        System.arraycopy(k, 1, stateGain, 0, stateGain.length);
        double kr = ki / (-integralPole);
        return new IntegralDesign(design, new TrackingLaw(stateGain, ki, kr, integralPole));
    }

    /** The law of a plain (non-augmented) design: u = kr r - K z with kr for unit DC gain. */
    public static TrackingLaw plainLaw(HighOrderDesign design) {
        return new TrackingLaw(design.gain(), 0, design.referenceGain(), null);
    }
}
