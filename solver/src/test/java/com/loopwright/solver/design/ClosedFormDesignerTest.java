package com.loopwright.solver.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.Random;
import org.junit.jupiter.api.Test;

class ClosedFormDesignerTest {

    private final ClosedFormDesigner designer = new ClosedFormDesigner();

    /**
     * Residual of A'P + PA + P(B1B1'/gamma^2 - B2B2')P + C1'C1 for the canonical plant, multiplied out
     * entry by entry here (independent of the designer's algebra). source: the Riccati equation itself.
     */
    private static double[] riccatiResidual(ClosedFormDesign design) {
        CanonicalPlant plant = design.plant();
        double[][] a = {{0, 1}, {-plant.a0(), -plant.a1()}};
        double[][] p = {{design.p11(), design.p12()}, {design.p12(), design.p22()}};
        double r22 = (plant.d() == 0 ? 0 : plant.d() * plant.d() / (design.gamma() * design.gamma()))
                - plant.b() * plant.b();
        double[][] q = {{design.rho1() * design.rho1(), 0}, {0, design.rho2() * design.rho2()}};
        double[] residual = new double[3];
        int n = 0;
        for (int[] ij : new int[][] {{0, 0}, {0, 1}, {1, 1}}) {
            int i = ij[0];
            int j = ij[1];
            double value = q[i][j];
            for (int m = 0; m < 2; m++) {
                value += a[m][i] * p[m][j] + p[i][m] * a[m][j];
            }
            value += p[i][1] * r22 * p[1][j];
            residual[n++] = value;
        }
        return residual;
    }

    private static double scale(ClosedFormDesign design) {
        return Math.abs(design.p11())
                + Math.abs(design.p12()) * design.plant().b() * design.plant().b()
                + design.rho1() * design.rho1()
                + design.rho2() * design.rho2()
                + 1e-300;
    }

    // The project's demonstration axis (a packaging-line indexing axis): a0 = 0, a1 = 0.48, b = d = 400,
    // 0.15 s settling, 1.5% overshoot. Checked against the Riccati equation and the target polynomial.
    @Test
    void indexingAxisDesignSolvesTheRiccatiEquationAndPlacesThePoles() {
        CanonicalPlant plant = new CanonicalPlant(0, 0.48, 400, 400);
        TargetDynamics target = new TargetDynamics(0.8, 25);
        ClosedFormDesign design = designer.design(plant, target, new GammaChoice.MarginOverMinimum(1.2));
        for (double r : riccatiResidual(design)) {
            assertEquals(0, r / scale(design), 1e-13);
        }
        // source: closed-loop characteristic polynomial s^2 + (a1 + b k2) s + (a0 + b k1) of
        // x2' = -a0 x1 - a1 x2 - b (k1 x1 + k2 x2).
        assertEquals(2 * 0.8 * 25, plant.a1() + plant.b() * design.velocityGain(), 1e-9);
        assertEquals(625, plant.a0() + plant.b() * design.positionGain(), 1e-9);
        assertEquals(1.2 * design.gammaMin(), design.gamma(), 1e-15);
    }

    private static boolean allConditionsHold(CanonicalPlant plant, PoleMatch m, double gamma) {
        // Each requirement written directly from its definition (source: the Riccati entries and
        // the Hurwitz test of a 2x2 companion matrix, any linear systems textbook).
        double k = plant.b() * plant.b() - plant.d() * plant.d() / (gamma * gamma);
        double rho1Sq = 2 * plant.a0() * m.p12() + k * m.p12() * m.p12();
        double rho2Sq = 2 * plant.a1() * m.p22() - 2 * m.p12() + k * m.p22() * m.p22();
        double p11 = plant.a1() * m.p12() + plant.a0() * m.p22() + k * m.p12() * m.p22();
        double det = p11 * m.p22() - m.p12() * m.p12();
        return rho1Sq >= 0
                && rho2Sq >= 0
                && p11 > 0
                && det > 0
                && plant.a1() + k * m.p22() > 0
                && plant.a0() + k * m.p12() > 0;
    }

    @Test
    void gammaMinIsTightOnRandomFeasiblePlants() {
        Random random = new Random(20261202L);
        int checked = 0;
        for (int trial = 0; trial < 2000 && checked < 300; trial++) {
            CanonicalPlant plant = new CanonicalPlant(
                    -5 + 25 * random.nextDouble(),
                    3 * random.nextDouble(),
                    0.5 + 500 * random.nextDouble(),
                    0.1 + 500 * random.nextDouble());
            TargetDynamics target =
                    new TargetDynamics(0.72 + 0.27 * random.nextDouble(), 0.5 + 60 * random.nextDouble());
            if (designer.obstacle(plant, target).isPresent()) {
                continue;
            }
            checked++;
            ClosedFormDesign design = designer.design(plant, target, new GammaChoice.MarginOverMinimum(1.2));
            PoleMatch match = PoleMatch.of(plant, target);
            assertTrue(allConditionsHold(plant, match, design.gammaMin() * (1 + 1e-7)), plant + " " + target);
            assertFalse(allConditionsHold(plant, match, design.gammaMin() * (1 - 1e-7)), plant + " " + target);
            for (double r : riccatiResidual(design)) {
                assertEquals(0, r / scale(design), 1e-11, plant + " " + target);
            }
        }
        assertTrue(checked >= 200, "feasible random cases: " + checked);
    }

    // source: project method notes, section "Where the method cannot go": for a0 = 0 the velocity weight is
    // real for some gamma only if zeta >= 1/sqrt(2).
    @Test
    void dampingBelowOneOverRootTwoIsInfeasibleForAPureInertia() {
        CanonicalPlant plant = new CanonicalPlant(0, 0.48, 400, 400);
        var obstacle = designer.obstacle(plant, new TargetDynamics(0.70, 25));
        assertTrue(obstacle.isPresent());
        assertTrue(obstacle.get().dampingBound());
        assertTrue(designer.obstacle(plant, new TargetDynamics(0.72, 25)).isEmpty());
    }

    @Test
    void specSlowerThanThePlantIsInfeasible() {
        // wn^2 <= a0: the spec is no stiffer than the plant (p12 <= 0).
        assertTrue(designer.obstacle(new CanonicalPlant(100, 0, 1, 1), new TargetDynamics(0.8, 9))
                .orElseThrow()
                .reason()
                .contains("sqrt(a0)"));
        // 2 zeta wn <= a1: the plant is more damped than the spec (p22 <= 0).
        assertTrue(designer.obstacle(new CanonicalPlant(0, 50, 1, 1), new TargetDynamics(0.8, 20))
                .orElseThrow()
                .reason()
                .contains("damping"));
    }

    @Test
    void fixedGammaBelowTheBoundIsRejectedWithAProposal() {
        CanonicalPlant plant = new CanonicalPlant(0, 0.48, 400, 400);
        TargetDynamics target = new TargetDynamics(0.8, 25);
        double gammaMin = designer.design(plant, target, new GammaChoice.MarginOverMinimum(2))
                .gammaMin();
        var error = assertThrows(
                InfeasibleDesignException.class,
                () -> designer.design(plant, target, new GammaChoice.Fixed(0.9 * gammaMin)));
        assertEquals(SpecQuantity.GAMMA, error.infeasibility().quantity());
        assertEquals(1.2 * gammaMin, error.infeasibility().proposals().get(0).value(), 1e-12 * gammaMin);
    }

    // source: with d = 0 the Riccati equation loses its gamma term (k = b^2) and gamma is free.
    @Test
    void noDisturbanceChannelLeavesGammaFree() {
        ClosedFormDesign design = designer.design(
                new CanonicalPlant(4, 0.2, 2, 0), new TargetDynamics(0.8, 6), new GammaChoice.MarginOverMinimum(1.2));
        assertEquals(0, design.gammaMin());
        for (double r : riccatiResidual(design)) {
            assertEquals(0, r / scale(design), 1e-13);
        }
    }

    // The best gamma for the position certificate gamma/rho1 minimizes it: compare with a scan over gamma.
    // source: calculus on gamma^2/rho1^2(gamma); the scan is an independent numeric route.
    @Test
    void bestPositionCertificateGammaMinimizesTheBound() {
        // An unstable plant (a0 < 0, an inverted-pendulum-like balance loop), where the rho1 condition binds.
        CanonicalPlant plant = new CanonicalPlant(-9, 0.4, 3, 2);
        TargetDynamics target = new TargetDynamics(0.99, 8);
        ClosedFormDesign base = designer.design(plant, target, new GammaChoice.MarginOverMinimum(1.01));
        double best = base.positionCertificateBestGamma().orElseThrow();
        double bestBound = designer.design(plant, target, new GammaChoice.Fixed(best))
                .positionPerDisturbanceBound()
                .orElseThrow();
        for (double g = base.gammaMin() * 1.001; g < base.gammaMin() * 50; g *= 1.01) {
            double bound = designer.design(plant, target, new GammaChoice.Fixed(g))
                    .positionPerDisturbanceBound()
                    .orElseThrow();
            assertTrue(bound >= bestBound * (1 - 1e-12), "gamma " + g);
        }
    }
}
