package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.NormalizedSettlingTime;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The closed-form step metrics against the exact zero-order-hold simulation ({@link StepResponseMetrics}, the
 * independent numeric route: matrix exponential of the loop, events refined between samples) on seeded random
 * loops covering under-, critically and overdamped poles, both signs of b, kr and the step, and four bands.
 */
class TwoStateStepMetricsTest {

    private static final int LOOPS = 600;
    private static final double[] BANDS = {0.001, 0.01, 0.02, 0.05};

    /**
     * Tolerances: both routes are exact up to rounding. Times and peak control agree to 1e-8 relative (the
     * simulation propagates the state over up to 10^5 samples, each step adding ~1e-15 relative error, and
     * refines events by Brent's method to a few ulps); overshoot to 1e-7 percentage points (absolute: the
     * simulated peak value 1 + OS carries the rounding of the final value, ~1e-9 of it after the propagation).
     */
    private static final double RELATIVE_TIME = 1e-8;

    private static final double OVERSHOOT_POINTS = 1e-7;

    private final StepResponseMetrics simulation = new StepResponseMetrics();

    @Test
    void randomLoopsMatchTheSimulation() {
        SplittableRandom random = new SplittableRandom(18);
        int underdamped = 0;
        int overdamped = 0;
        int compared = 0;
        for (int i = 0; i < LOOPS; i++) {
            double zeta = i % 50 == 0 ? 1.0 : Math.exp(random.nextDouble(Math.log(0.05), Math.log(5)));
            double wn = Math.exp(random.nextDouble(Math.log(0.1), Math.log(1000)));
            double band = BANDS[random.nextInt(BANDS.length)];
            double b = (random.nextBoolean() ? 1 : -1) * Math.exp(random.nextDouble(-3, 6));
            CanonicalPlant plant = new CanonicalPlant(random.nextDouble(-5, 5), random.nextDouble(-2, 2), b, 1);
            // pole placement: c0 = a0 + b k1 = wn^2, c1 = a1 + b k2 = 2 zeta wn
            FeedbackGains gains = new FeedbackGains(
                    (wn * wn - plant.a0()) / b,
                    (2 * zeta * wn - plant.a1()) / b,
                    random.nextDouble(0.2, 3) * (random.nextBoolean() ? 1 : -1));
            double step = random.nextDouble(0.1, 10) * (random.nextBoolean() ? 1 : -1);
            double damping = LoopMatrices.closedLoopDamping(plant, gains);
            double stiffness = LoopMatrices.closedLoopStiffness(plant, gains);
            double loopZeta = damping / (2 * Math.sqrt(stiffness));
            if (loopZeta < 1 && NormalizedSettlingTime.analyse(loopZeta, band).bandTouchLogDistance() < 1e-6) {
                continue; // a peak on the band edge: the settling time jumps there, either side is right
            }
            StepMetrics fast = TwoStateStepMetrics.measure(plant, gains, step, band);
            StepMetrics simulated = simulate(plant, gains, step, band);
            String where = "loop " + i + ": zeta " + loopZeta + ", wn " + wn + ", band " + band;
            assertRelative(simulated.riseTimeSeconds(), fast.riseTimeSeconds(), where + " rise");
            assertRelative(simulated.settlingTimeSeconds(), fast.settlingTimeSeconds(), where + " settling");
            assertEquals(simulated.overshootPercent(), fast.overshootPercent(), OVERSHOOT_POINTS, where + " OS");
            assertRelative(simulated.peakControl(), fast.peakControl(), where + " peak control");
            assertRelative(simulated.finalValue(), fast.finalValue(), where + " final value");
            assertEquals(
                    simulated.steadyStateError(),
                    fast.steadyStateError(),
                    1e-9 * Math.abs(step),
                    where + " steady error");
            assertEquals(simulated.undershootPercent(), fast.undershootPercent(), OVERSHOOT_POINTS, where);
            if (fast.overshootPercent() > 1e-3) {
                // a flat top below 1e-5 of the final value has no well-defined argmax in double precision
                assertRelative(simulated.peakTimeSeconds(), fast.peakTimeSeconds(), where + " peak time");
                underdamped++;
            } else if (loopZeta >= 1) {
                // no overshoot: the largest output is at the window's end in both routes; the simulation's window
                // comes from computed eigenvalues, which a (nearly) double pole moves by ~sqrt(eps) ~ 1.5e-8
                assertEquals(
                        simulated.peakTimeSeconds(),
                        fast.peakTimeSeconds(),
                        1e-6 * simulated.peakTimeSeconds(),
                        where + " window end");
                overdamped++;
            }
            compared++;
        }
        assertTrue(compared >= LOOPS - 5, "compared " + compared);
        assertTrue(underdamped >= 200 && overdamped >= 100, underdamped + " underdamped, " + overdamped + " not");
    }

    @Test
    void criticallyDampedDoubleIntegratorMatchesTheTextbook() {
        // y'' = u with u = wn^2 (r - y) - 2 wn y' (zeta = 1): y = 1 - e^(-wn t)(1 + wn t) (any control textbook);
        // rise 10-90% is 3.3579/wn (from memory, the standard table value 3.36), no overshoot, u(0+) = wn^2 is the
        // largest |u| since u = y'' = wn^2 (1 - wn t) e^(-wn t) decays from there and its minimum -wn^2 e^-2 is
        // smaller in size.
        double wn = 4;
        StepMetrics m = TwoStateStepMetrics.measure(
                new CanonicalPlant(0, 0, 1, 1), new FeedbackGains(wn * wn, 2 * wn, wn * wn), 1, 0.02);
        assertEquals(3.3579 / wn, m.riseTimeSeconds(), 1e-4 / wn);
        assertEquals(0, m.overshootPercent(), 0);
        assertEquals(wn * wn, m.peakControl(), 1e-12);
        assertEquals(1, m.finalValue(), 1e-15);
        // settling to 2%: (1 + tau) e^-tau = 0.02 at tau = 5.8339 (solved by hand, from memory of the table)
        assertEquals(5.8339 / wn, m.settlingTimeSeconds(), 1e-4 / wn);
    }

    @Test
    void unstableLoopIsRejected() {
        assertThrows(
                IllegalArgumentException.class,
                () -> TwoStateStepMetrics.measure(
                        new CanonicalPlant(0, 0, 1, 1), new FeedbackGains(1, -1, 1), 1, 0.02));
    }

    private StepMetrics simulate(CanonicalPlant plant, FeedbackGains gains, double step, double band) {
        double horizon = LoopMatrices.horizonSeconds(plant, gains);
        double needed = Math.ceil(horizon
                        * LoopMatrices.fastestOscillation(plant, gains)
                        / StepResponseMetrics.MAX_RADIANS_PER_SAMPLE)
                + 2;
        return simulation.measure(LinearLoop.ofStep(plant, gains), step, horizon, (int) Math.max(2000, needed), band);
    }

    private static void assertRelative(double expected, double actual, String message) {
        assertEquals(expected, actual, RELATIVE_TIME * Math.abs(expected), message);
    }
}
