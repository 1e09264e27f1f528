package com.loopwright.solver.discrete;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

class DiscreteControllersTest {

    /** Taylor terms of exp(M / 2^s) (the scaled norm is below 0.1, so 30 terms reach rounding). */
    private static final int TAYLOR_TERMS = 30;
    /** Squarings: 2^12 = 4096 halves the block norm (about 80) to 0.02. */
    private static final int SQUARINGS = 12;

    /**
     * The ZOH blocks of the observer-plus-integrator controller against exp([[Ac, Bin], [0, 0]] T) computed by an
     * independent route: Taylor series with scaling and squaring (textbook, Moler and Van Loan's "nineteen dubious
     * ways", method 3), built here from the continuous matrices by hand.
     */
    @Test
    void zeroOrderHoldMatchesTaylorScalingAndSquaring() {
        DiscreteController d = ControllerFixtures.observerWithIntegrator();
        double[] k = ControllerFixtures.integralGains();
        double w = ControllerFixtures.OBSERVER_POLE;
        double a1 = ControllerFixtures.A1;
        double l1 = 2 * w - a1;
        double l2 = w * w - a1 * l1;
        // q = [xh1, xh2, xi]; inputs [y, r, u]
        double[][] m = {
            {-l1, 1, 0, l1, 0, 0},
            {-l2, -a1, 0, l2, 0, ControllerFixtures.B},
            {0, 0, 0, -1, 1, 0},
            {0, 0, 0, 0, 0, 0},
            {0, 0, 0, 0, 0, 0},
            {0, 0, 0, 0, 0, 0}
        };
        double[][] e = expm(m, ControllerFixtures.PERIOD_S);
        double[][] phi = d.stateMatrix();
        double[][] gy = d.measurementInput();
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                assertEquals(e[i][j], phi[i][j], 1e-11 * (1 + Math.abs(e[i][j])), "Phi " + i + "," + j);
            }
            assertEquals(e[i][3], gy[i][0], 1e-11 * (1 + Math.abs(e[i][3])), "Gy " + i);
            assertEquals(e[i][4], d.setpointInput()[i], 1e-13, "gr " + i);
            assertEquals(e[i][5], d.commandInput()[i], 1e-11 * (1 + Math.abs(e[i][5])), "gu " + i);
        }
        assertEquals(2, d.integratorIndex());
        assertEquals(-k[2], d.stateGain()[2]);
        assertEquals(k[0], d.stateGain()[0]);
        assertEquals(0.0, d.measurementGain()[0]);
    }

    /** The integrator of r - y over a held period: xi+ = xi + T (rd - yd1), exactly (closed form of the integral). */
    @Test
    void integratorAloneIsTheClosedFormSum() {
        DiscreteController d = ControllerFixtures.fullStateWithIntegrator();
        double t = ControllerFixtures.PERIOD_S;
        assertEquals(1.0, d.stateMatrix()[0][0], 1e-15);
        assertEquals(-t, d.measurementInput()[0][0], 1e-18);
        assertEquals(0.0, d.measurementInput()[0][1], 1e-18);
        assertEquals(t, d.setpointInput()[0], 1e-18);
        assertEquals(0.0, d.commandInput()[0], 1e-18);
        assertEquals(ControllerFixtures.integralGains()[0], d.measurementGain()[0]);
    }

    @Test
    void withoutObserverTheFullStateMustBeMeasured() {
        ContinuousControllerDesign positionOnly = new ContinuousControllerDesign(
                ControllerFixtures.a(),
                ControllerFixtures.b2(),
                ControllerFixtures.positionOnly(),
                new double[] {1, 1},
                OptionalDouble.empty(),
                new double[][] {{}, {}},
                1);
        assertThrows(
                IllegalArgumentException.class,
                () -> DiscreteControllers.fromContinuous(ControllerFixtures.PERIOD_S, positionOnly));
    }

    /** Integral action removes the steady position error under a constant load (the load-step scenario). */
    @Test
    void integralActionRejectsTheLoadStep() {
        for (DiscreteController d : new DiscreteController[] {
            ControllerFixtures.observerWithIntegrator(), ControllerFixtures.fullStateWithIntegrator()
        }) {
            Scenario s = ControllerFixtures.scenarios()[1];
            double[][] c = d.measuredCount() == 1 ? ControllerFixtures.positionOnly() : ControllerFixtures.fullState();
            double[][] rows = new ClosedLoopSimulator()
                    .run(
                            d,
                            ControllerFixtures.settings(d.measuredCount()),
                            ControllerFixtures.a(),
                            ControllerFixtures.b2(),
                            c,
                            s);
            double finalPosition = rows[rows.length - 1][0];
            // x1 is the deviation from y0; the setpoint deviation is the step 0.01
            assertEquals(0.01, finalPosition, 1e-5, "steady position under load 2.0");
            double midLoad = rows[330][0];
            assertTrue(Math.abs(midLoad - 0.01) > 1e-4, "the load step is visible before the integrator removes it");
        }
    }

    /** Bumpless enable: on each rising edge of Enable the command is 0, the value held while disabled. */
    @Test
    void enableDoesNotJump() {
        DiscreteController d = ControllerFixtures.observerWithIntegrator();
        Scenario s = ControllerFixtures.scenarios()[3];
        double[][] rows = new ClosedLoopSimulator()
                .run(
                        d,
                        ControllerFixtures.settings(1),
                        ControllerFixtures.a(),
                        ControllerFixtures.b2(),
                        ControllerFixtures.positionOnly(),
                        s);
        int u = 2;
        assertEquals(0.0, rows[5][u], 1e-12, "first enable");
        assertEquals(0.0, rows[320][u], 1e-12, "re-enable after the mid-run disable");
        assertEquals(0.0, rows[319][u], 0.0, "disabled: 0");
        assertTrue(Math.abs(rows[321][u]) > 1e-6, "the law acts after the enable sample");
    }

    /**
     * Conditional integration: whenever the clamp is active the integrator step never pushes the command further
     * into the limit, and it holds while disabled.
     */
    @Test
    void integratorHoldsInSaturationAndWhileDisabled() {
        DiscreteController d = ControllerFixtures.observerWithIntegrator();
        ControllerSettings settings = ControllerFixtures.settings(1);
        ControllerStep step = new ControllerStep(d, settings);
        Scenario s = ControllerFixtures.scenarios()[2];
        int saturatedSamples = 0;
        double kq = d.stateGain()[2];
        double[][] rows = new ClosedLoopSimulator()
                .run(
                        d,
                        settings,
                        ControllerFixtures.a(),
                        ControllerFixtures.b2(),
                        ControllerFixtures.positionOnly(),
                        s);
        for (int k = 0; k < s.steps(); k++) {
            double before = step.state()[2];
            StepOutput out = step.step(
                    s.enable()[k],
                    s.setpoint()[k],
                    new double[] {rows[k][0] + 0.05},
                    s.gainScale()[k],
                    s.measuredPeriodSeconds()[k]);
            assertEquals(rows[k][2], out.command(), 0.0, "the step is the simulator's");
            double push = -kq * (step.state()[2] - before);
            if (out.command() == settings.commandMax()) {
                saturatedSamples++;
                assertTrue(push <= 0, "no windup at the upper limit, sample " + k);
            }
            if (out.command() == settings.commandMin()) {
                saturatedSamples++;
                assertTrue(push >= 0, "no windup at the lower limit, sample " + k);
            }
            if (!s.enable()[k]) {
                assertEquals(before, step.state()[2], 0.0, "held while disabled");
            }
        }
        assertTrue(saturatedSamples > 10, "the scenario saturates: " + saturatedSamples);
        assertEquals(2.0, rows[s.steps() - 1][0], 1e-3, "reaches the large setpoint");
    }

    /** Status bits: disabled exactly while Enable is false, period mismatch exactly where Tm = 1.5 T. */
    @Test
    void statusBitsFollowTheInputs() {
        DiscreteController d = ControllerFixtures.plainLaw();
        Scenario s = ControllerFixtures.scenarios()[3];
        double[][] rows = new ClosedLoopSimulator()
                .run(
                        d,
                        ControllerFixtures.settings(2),
                        ControllerFixtures.a(),
                        ControllerFixtures.b2(),
                        ControllerFixtures.fullState(),
                        s);
        for (int k = 0; k < s.steps(); k++) {
            int status = (int) rows[k][3];
            assertEquals(!s.enable()[k], (status & StepOutput.STATUS_DISABLED) != 0, "disabled at " + k);
            assertEquals(k >= 400 && k < 410, (status & StepOutput.STATUS_PERIOD_MISMATCH) != 0, "period at " + k);
        }
        // the period check's edge: 10 % of T is inside, 10 % plus a little is outside
        ControllerStep step = new ControllerStep(d, ControllerFixtures.settings(2));
        double t = ControllerFixtures.PERIOD_S;
        assertFalse(step.step(true, 0, new double[2], 1, t * 1.0999).periodMismatch());
        assertTrue(step.step(true, 0, new double[2], 1, t * 1.1001).periodMismatch());
        assertTrue(step.step(true, 0, new double[2], 1, t * 0.8999).periodMismatch());
    }

    /** The gain scale is limited to [0, 1]: 1.7 acts as 1, -0.3 as 0 (the command is then the bias u0). */
    @Test
    void gainScaleIsLimitedToTheUnitInterval() {
        DiscreteController d = ControllerFixtures.plainLaw();
        ControllerSettings settings = ControllerFixtures.settings(2);
        double[] y = {0.04, 0.1};
        double full =
                new ControllerStep(d, settings).step(true, 0.06, y, 1.0, 1e-3).command();
        assertEquals(
                full,
                new ControllerStep(d, settings).step(true, 0.06, y, 1.7, 1e-3).command(),
                0.0);
        assertEquals(
                0.2,
                new ControllerStep(d, settings).step(true, 0.06, y, -0.3, 1e-3).command(),
                0.0);
        double half =
                new ControllerStep(d, settings).step(true, 0.06, y, 0.5, 1e-3).command();
        assertEquals(0.2 + 0.5 * (full - 0.2), half, 1e-15);
    }

    private static double[][] expm(double[][] m, double t) {
        int n = m.length;
        double scale = t / Math.pow(2, SQUARINGS);
        double[][] x = new double[n][n];
        double[][] term = identity(n);
        double[][] sum = identity(n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                x[i][j] = m[i][j] * scale;
            }
        }
        for (int p = 1; p <= TAYLOR_TERMS; p++) {
            term = multiply(term, x);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    term[i][j] /= p;
                    sum[i][j] += term[i][j];
                }
            }
        }
        for (int s = 0; s < SQUARINGS; s++) {
            sum = multiply(sum, sum);
        }
        return sum;
    }

    private static double[][] identity(int n) {
        double[][] id = new double[n][n];
        for (int i = 0; i < n; i++) {
            id[i][i] = 1;
        }
        return id;
    }

    private static double[][] multiply(double[][] a, double[][] b) {
        int n = a.length;
        double[][] c = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double s = 0;
                for (int k = 0; k < n; k++) {
                    s += a[i][k] * b[k][j];
                }
                c[i][j] = s;
            }
        }
        return c;
    }
}
