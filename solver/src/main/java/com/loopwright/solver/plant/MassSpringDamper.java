package com.loopwright.solver.plant;

/**
 * A translational mass on a spring and damper, driven by a force:
 * <pre>
 *   m y'' + c y' + k y = F + w
 * </pre>
 * with y the position [m], F the actuator force [N] and w a disturbance force [N]. Dividing by m gives the
 * canonical form a0 = k/m, a1 = c/m, b = d = 1/m.
 *
 * @param massKg                  m, positive
 * @param dampingNsPerM           c, not negative
 * @param stiffnessNPerM          k, not negative (0 for a free mass on a guide)
 */
public record MassSpringDamper(double massKg, double dampingNsPerM, double stiffnessNPerM) implements PlantForm {

    public MassSpringDamper {
        PhysicalCheck.positive("mass", massKg, "mass");
        PhysicalCheck.nonNegative("damping", dampingNsPerM, "damping");
        PhysicalCheck.nonNegative("stiffness", stiffnessNPerM, "stiffness");
    }

    @Override
    public CanonicalPlant canonical() {
        return PhysicalCheck.canonical(stiffnessNPerM / massKg, dampingNsPerM / massKg, 1 / massKg, 1 / massKg, true);
    }
}
