package com.loopwright.solver.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.OvershootDamping;
import com.loopwright.solver.spec.TargetDynamics;
import org.junit.jupiter.api.Test;

/**
 * The damping limit the infeasible-spec advice states: for a plant without stiffness (a0 = 0) the certified
 * (H-infinity, pole-matched Riccati) loop cannot be damped below 1/sqrt(2). Source: the closed-form conditions
 * (project method notes, sections 3 and 6: rho2 real for some gamma iff wn^2 (4 zeta^2 - 2) >= a1^2 - 2 a0),
 * checked here by brute force over a dense natural-frequency grid with the ClosedFormDesigner. The overshoot at
 * zeta = 1/sqrt(2) is exp(-pi) = 4.32 % (zeta/sqrt(1 - zeta^2) = 1 in the textbook overshoot formula), the
 * LARGEST overshoot the certified loop can have: smaller overshoots (more damping) stay feasible.
 */
class StiffnessFreeDampingLimitTest {

    /** Natural frequencies tried, log-spaced over 1e-3 .. 1e5 rad/s. */
    private static final int FREQUENCIES = 2000;

    private static final double ZETA_LIMIT = 1 / Math.sqrt(2);
    private static final double[] PLANT_DAMPINGS = {0, 0.01, 0.48, 3};

    private final ClosedFormDesigner designer = new ClosedFormDesigner();

    private boolean feasibleAtSomeFrequency(CanonicalPlant plant, double zeta) {
        for (int i = 0; i < FREQUENCIES; i++) {
            double wn = Math.pow(10, -3 + 8.0 * i / (FREQUENCIES - 1));
            if (designer.obstacle(plant, new TargetDynamics(zeta, wn)).isEmpty()) {
                return true;
            }
        }
        return false;
    }

    @Test
    void noNaturalFrequencyCertifiesADampingBelowOneOverRootTwo() {
        for (double a1 : PLANT_DAMPINGS) {
            CanonicalPlant plant = new CanonicalPlant(0, a1, 2, 0.5);
            for (double zeta : new double[] {0.3, 0.6, 0.70, ZETA_LIMIT - 1e-4}) {
                assertTrue(!feasibleAtSomeFrequency(plant, zeta), "a1 = " + a1 + ", zeta = " + zeta);
                DesignObstacle obstacle =
                        designer.obstacle(plant, new TargetDynamics(zeta, 10)).orElseThrow();
                assertTrue(obstacle.dampingBound());
                assertTrue(obstacle.reason().contains("limit of the certified method, not a fault of the plant"));
            }
            for (double zeta : new double[] {ZETA_LIMIT + 1e-3, 0.75, 0.9}) {
                assertTrue(feasibleAtSomeFrequency(plant, zeta), "a1 = " + a1 + ", zeta = " + zeta);
            }
        }
    }

    @Test
    void theLimitIsAnOvershootOfFourPointThreeTwoPercent() {
        // source: textbook overshoot formula OS = exp(-pi zeta/sqrt(1 - zeta^2)); at zeta = 1/sqrt(2) it is exp(-pi)
        assertEquals(Math.exp(-Math.PI), OvershootDamping.overshoot(ZETA_LIMIT), 1e-15);
        assertEquals(4.32, 100 * Math.exp(-Math.PI), 0.005);
        assertEquals(ZETA_LIMIT, OvershootDamping.dampingRatio(Math.exp(-Math.PI)), 1e-12);
    }

    @Test
    void aStiffPlantIsNotBoundByIt() {
        // a0 > 0 with a1^2 < 2 a0: wn^2 (4 zeta^2 - 2) >= a1^2 - 2 a0 < 0 holds near wn = sqrt(a0) for zeta < 1/sqrt(2)
        CanonicalPlant stiff = new CanonicalPlant(100, 0.5, 2, 0.5);
        assertTrue(feasibleAtSomeFrequency(stiff, 0.6));
    }
}
