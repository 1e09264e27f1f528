package com.loopwright.solver.plant;

/**
 * A rotary axis driven through an optional gearbox, seen from the load side:
 * <pre>
 *   J q'' + c q' = N kt i + w
 * </pre>
 * with q the load angle [rad], i the motor current [A], w a load torque [N m], J the total inertia reflected to
 * the load [kg m^2], c the viscous friction [N m s/rad], kt the motor torque constant [N m/A] and N the gear
 * ratio (motor turns per load turn). Dividing by J gives the canonical form a0 = 0, a1 = c/J, b = N kt/J,
 * d = 1/J.
 *
 * @param inertiaKgM2                  J, positive
 * @param viscousFrictionNmsPerRad     c, not negative
 * @param torqueConstantNmPerAmp       kt, non-zero (its sign sets the direction of positive current)
 * @param gearRatio                    N, positive (1 for a direct drive)
 */
public record RotaryAxis(
        double inertiaKgM2, double viscousFrictionNmsPerRad, double torqueConstantNmPerAmp, double gearRatio)
        implements PlantForm {

    public RotaryAxis {
        PhysicalCheck.positive("inertia", inertiaKgM2, "inertia");
        PhysicalCheck.nonNegative("viscousFriction", viscousFrictionNmsPerRad, "viscous friction");
        PhysicalCheck.nonZero("torqueConstant", torqueConstantNmPerAmp, "torque constant");
        PhysicalCheck.positive("gearRatio", gearRatio, "gear ratio");
    }

    @Override
    public CanonicalPlant canonical() {
        return PhysicalCheck.canonical(
                0,
                viscousFrictionNmsPerRad / inertiaKgM2,
                gearRatio * torqueConstantNmPerAmp / inertiaKgM2,
                1 / inertiaKgM2,
                true);
    }
}
