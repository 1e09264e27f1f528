package com.loopwright.solver.discrete;

import java.util.Arrays;
import java.util.OptionalDouble;

/**
 * Small designs for the export tests, placed by hand on the packaging-line indexing axis x1' = x2,
 * x2' = -a1 x2 + b u (a1 = 0.48 1/s, b = 400). Integral action u = kr r - k1 x1 - k2 x2 + ki xi, xi' = r - x1 gives
 * the characteristic polynomial s^3 + (a1 + b k2) s^2 + b k1 s + b ki (expansion of det(sI - A_cl), by hand);
 * matching (s + p)^3 puts a triple pole at -p. The observer xh' = A xh + B u + L (x1 - xh1) has
 * s^2 + (l1 + a1) s + (a1 l1 + l2), matched to (s + w)^2.
 */
public final class ControllerFixtures {

    /** a1 [1/s] of the indexing axis. */
    public static final double A1 = 0.48;
    /** b [x1 units / s^2 per u unit]. */
    public static final double B = 400;
    /** Task period [s]. */
    public static final double PERIOD_S = 1e-3;
    /** Closed-loop triple pole [rad/s]. */
    public static final double LOOP_POLE = 40;
    /** Observer double pole [rad/s] (five times the loop, common practice). */
    public static final double OBSERVER_POLE = 200;
    /** Samples per scenario (1 s: the load step at 0.3 s settles with 0.7 s to spare). */
    public static final int STEPS = 1000;

    private ControllerFixtures() {}

    public static double[][] a() {
        return new double[][] {{0, 1}, {0, -A1}};
    }

    public static double[] b2() {
        return new double[] {0, B};
    }

    public static double[][] positionOnly() {
        return new double[][] {{1, 0}};
    }

    public static double[][] fullState() {
        return new double[][] {{1, 0}, {0, 1}};
    }

    /** [k1, k2, ki] for the triple pole at -LOOP_POLE. */
    static double[] integralGains() {
        double p = LOOP_POLE;
        return new double[] {3 * p * p / B, (3 * p - A1) / B, p * p * p / B};
    }

    /** Position-only sensing, observer and integral action: q = [xh1, xh2, xi]. */
    public static DiscreteController observerWithIntegrator() {
        double[] k = integralGains();
        double w = OBSERVER_POLE;
        double l1 = 2 * w - A1;
        double l2 = w * w - A1 * l1;
        return DiscreteControllers.fromContinuous(
                PERIOD_S,
                new ContinuousControllerDesign(
                        a(),
                        b2(),
                        positionOnly(),
                        new double[] {k[0], k[1]},
                        OptionalDouble.of(k[2]),
                        new double[][] {{l1}, {l2}},
                        0.5 * k[0]));
    }

    /** Full state measured, integral action: q = [xi]. */
    public static DiscreteController fullStateWithIntegrator() {
        double[] k = integralGains();
        return DiscreteControllers.fromContinuous(
                PERIOD_S,
                new ContinuousControllerDesign(
                        a(),
                        b2(),
                        fullState(),
                        new double[] {k[0], k[1]},
                        OptionalDouble.of(k[2]),
                        new double[][] {{}, {}},
                        0));
    }

    /** Today's plain law u = kr r - (k1 x1 + k2 x2) for a double pole at -LOOP_POLE (kr = k1: unit DC gain). */
    public static DiscreteController plainLaw() {
        double p = LOOP_POLE;
        double k1 = p * p / B;
        double k2 = (2 * p - A1) / B;
        return DiscreteControllers.fromStateFeedback(PERIOD_S, k1, k2, k1);
    }

    /** Asymmetric limits, an operating point and the default period tolerance. */
    public static ControllerSettings settings(int measuredCount) {
        double[] y0 = new double[measuredCount];
        y0[0] = 0.05;
        return new ControllerSettings(-3, 5, 0.2, y0, ControllerSettings.DEFAULT_PERIOD_TOLERANCE);
    }

    /** The five scenarios of the export proof. */
    public static Scenario[] scenarios() {
        return new Scenario[] {
            scenario("setpoint step", 0.01, 0, -1, -1, 1.0),
            scenario("load step", 0.01, 2.0, -1, -1, 1.0),
            scenario("saturation", 2.0, 0, -1, -1, 1.0),
            scenario("disable and enable mid-run", 0.01, 1.0, 200, 320, 1.0),
            scenario("gain scale 0.5", 0.01, 1.0, -1, -1, 0.5)
        };
    }

    /**
     * Setpoint y0 + step from sample 10; load from sample 300; disabled in [off, on); gain scale throughout; the
     * measured period 1.5 T (a mismatch) on samples 400..409, else T.
     */
    static Scenario scenario(String name, double step, double load, int off, int on, double gainScale) {
        double[] r = new double[STEPS];
        double[] d = new double[STEPS];
        boolean[] en = new boolean[STEPS];
        double[] g = new double[STEPS];
        double[] tm = new double[STEPS];
        for (int k = 0; k < STEPS; k++) {
            r[k] = 0.05 + (k >= 10 ? step : 0);
            d[k] = k >= 300 ? load : 0;
            en[k] = !(k >= off && k < on);
            g[k] = gainScale;
            tm[k] = k >= 400 && k < 410 ? 1.5 * PERIOD_S : PERIOD_S;
        }
        Arrays.fill(en, 0, 5, false); // starts disabled: the first enable is a rising edge too
        return new Scenario(name, r, d, en, g, tm);
    }
}
