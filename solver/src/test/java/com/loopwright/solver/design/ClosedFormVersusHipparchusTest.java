package com.loopwright.solver.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.Random;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RiccatiEquationSolverImpl;
import org.junit.jupiter.api.Test;

/**
 * The closed-form P against Hipparchus' Riccati solver, an independent reference library.
 * With k = b^2 - d^2/gamma^2 &gt; 0 the H-infinity quadratic term diag(0, d^2/gamma^2 - b^2) equals
 * -B Rh^-1 B' with B = [0, 1]' and Rh = 1/k, the form Hipparchus solves (A'P + PA - P B Rh^-1 B' P + Q = 0).
 */
class ClosedFormVersusHipparchusTest {

    @Test
    void closedFormMatchesHipparchusOnRandomFeasibleDesigns() {
        ClosedFormDesigner designer = new ClosedFormDesigner();
        Random random = new Random(424242L);
        int compared = 0;
        double worst = 0;
        for (int trial = 0; trial < 5000 && compared < 220; trial++) {
            CanonicalPlant plant = new CanonicalPlant(
                    -5 + 25 * random.nextDouble(),
                    3 * random.nextDouble(),
                    0.5 + 50 * random.nextDouble(),
                    0.1 + 50 * random.nextDouble());
            TargetDynamics target = new TargetDynamics(0.72 + 0.27 * random.nextDouble(), 1 + 30 * random.nextDouble());
            if (designer.obstacle(plant, target).isPresent()) {
                continue;
            }
            ClosedFormDesign design =
                    designer.design(plant, target, new GammaChoice.MarginOverMinimum(1.05 + random.nextDouble()));
            double k = design.riccatiCurvature();
            if (!(k > 0)) {
                continue;
            }
            RealMatrix a = MatrixUtils.createRealMatrix(new double[][] {{0, 1}, {-plant.a0(), -plant.a1()}});
            RealMatrix b = MatrixUtils.createRealMatrix(new double[][] {{0}, {1}});
            RealMatrix q = MatrixUtils.createRealDiagonalMatrix(
                    new double[] {design.rho1() * design.rho1(), design.rho2() * design.rho2()});
            RealMatrix r = MatrixUtils.createRealMatrix(new double[][] {{1 / k}});
            RealMatrix p = new RiccatiEquationSolverImpl(a, b, q, r).getP();
            RealMatrix closed = MatrixUtils.createRealMatrix(
                    new double[][] {{design.p11(), design.p12()}, {design.p12(), design.p22()}});
            double difference = p.subtract(closed).getFrobeniusNorm() / closed.getFrobeniusNorm();
            worst = Math.max(worst, difference);
            assertEquals(0, difference, 1e-7, plant + " " + target);
            compared++;
        }
        assertTrue(compared >= 200, "compared " + compared);
        System.out.printf("closed form vs Hipparchus: %d designs, worst relative difference %.2e%n", compared, worst);
    }
}
