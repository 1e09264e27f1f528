package com.loopwright.solver.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The cancellation-free step shape against the textbook case formulas, and its impulse as the derivative. */
class UnitStepShapeTest {

    @Test
    void agreesWithTheTextbookFormulasInEveryDampingRegime() {
        for (double zeta : new double[] {0, 0.05, 0.3, 0.707, 0.95, 1, 1.2, 3, 20}) {
            for (double tau = 0.01; tau < 40; tau *= 1.37) {
                assertEquals(
                        TextbookStep.of(tau, 1, zeta),
                        UnitStepShape.step(tau, zeta),
                        1e-12,
                        "zeta " + zeta + " tau " + tau);
            }
        }
    }

    @Test
    void isContinuousThroughCriticalDamping() {
        for (double tau : new double[] {0.1, 1, 5, 30}) {
            double critical = 1 - (1 + tau) * Math.exp(-tau);
            // |dS/dzeta| is at most about 1, so a 1e-9 change of zeta moves S by at most about 1e-9.
            assertEquals(critical, UnitStepShape.step(tau, 1 - 1e-9), 2e-9);
            assertEquals(critical, UnitStepShape.step(tau, 1 + 1e-9), 2e-9);
            assertEquals(UnitStepShape.step(tau, 1 - 1e-9), UnitStepShape.step(tau, 1 + 1e-9), 4e-9);
        }
    }

    // The fit differentiates S in zeta by central differences, so dS/dzeta must not jump at zeta = 1.
    @Test
    void dampingRatioDerivativeIsSmoothThroughCriticalDamping() {
        double h = 1e-6;
        for (double tau : new double[] {0.1, 1, 3, 5, 30}) {
            // source: Laplace pairs; dY/dzeta = -2 wn^3/(s + wn)^4 at zeta = 1, i.e. -tau^3 e^-tau / 3 (wn = 1).
            double expected = -tau * tau * tau * Math.exp(-tau) / 3;
            for (double zeta : new double[] {1 - 1e-7, 1, 1 + 1e-7}) {
                double slope = (UnitStepShape.step(tau, zeta + h) - UnitStepShape.step(tau, zeta - h)) / (2 * h);
                assertEquals(expected, slope, 1e-6, "zeta " + zeta + " tau " + tau);
            }
        }
    }

    @Test
    void impulseIsTheDerivativeOfTheStep() {
        for (double zeta : new double[] {0.2, 1, 2.5}) {
            for (double tau = 0.05; tau < 20; tau *= 1.5) {
                double h = 1e-5;
                double slope = (UnitStepShape.step(tau + h, zeta) - UnitStepShape.step(tau - h, zeta)) / (2 * h);
                assertEquals(slope, UnitStepShape.impulse(tau, zeta), 1e-8);
            }
        }
        assertEquals(0, UnitStepShape.step(-1, 0.5));
        assertEquals(0, UnitStepShape.impulse(0, 0.5));
    }
}
