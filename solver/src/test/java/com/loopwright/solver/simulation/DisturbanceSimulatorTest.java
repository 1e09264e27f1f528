package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.DisturbanceResponse;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.plant.DisturbanceProfile;
import com.loopwright.solver.robustness.IndexingAxis;
import org.junit.jupiter.api.Test;

class DisturbanceSimulatorTest {

    private final DisturbanceSimulator simulator = new DisturbanceSimulator();
    private final HInfinityNorm norm = new HInfinityNormCalculator()
            .compute(
                    LoopMatrices.closedLoop(IndexingAxis.PLANT, IndexingAxis.GAINS),
                    LoopMatrices.disturbanceInput(IndexingAxis.PLANT),
                    IndexingAxis.performanceOutput());

    @Test
    void observedGainOfRandomDisturbancesNeverExceedsTheNormWhichNeverExceedsGamma() {
        assertTrue(norm.value() <= IndexingAxis.DESIGN.gamma());
        double largest = 0;
        for (long seed = 1; seed <= 40; seed++) {
            double hold = 0.001 * seed;
            DisturbanceResponse r = simulator.simulate(
                    IndexingAxis.PLANT,
                    IndexingAxis.GAINS,
                    new DisturbanceProfile.BoundedRandom(0.2, hold, seed),
                    IndexingAxis.performanceOutput(),
                    0.6);
            assertTrue(r.observedGain() <= norm.value(), "seed " + seed + ": " + r.observedGain());
            largest = Math.max(largest, r.observedGain());
        }
        assertTrue(largest > 0.1 * norm.value(), "the random signals excite the loop: " + largest);
    }

    @Test
    void sinusoidAtThePeakFrequencyApproachesTheNorm() {
        // the test above can fail: a long sinusoid at the peak frequency reaches the norm from below
        double w = norm.peakFrequencyRadPerSec();
        DisturbanceResponse r = simulator.simulate(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                new DisturbanceProfile.Sinusoid(1, w),
                IndexingAxis.performanceOutput(),
                400 * 2 * Math.PI / w);
        assertTrue(r.observedGain() <= norm.value());
        assertTrue(r.observedGain() > 0.95 * norm.value(), r.observedGain() + " vs " + norm.value());
    }

    @Test
    void stepDisturbanceSettlesAtTheStaticDeflectionAndEnergiesAreExact() {
        // static deflection x1 = d w / (a0 + b k1) (final-value theorem)
        double w = 0.05;
        DisturbanceResponse r = simulator.simulate(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                new DisturbanceProfile.Step(w, 0.01),
                IndexingAxis.performanceOutput(),
                1.0);
        double[] x1 = r.trajectory().x1();
        double expected =
                IndexingAxis.PLANT.d() * w / LoopMatrices.closedLoopStiffness(IndexingAxis.PLANT, IndexingAxis.GAINS);
        assertEquals(expected, x1[x1.length - 1], 1e-6 * expected);
        assertNotNull(r.recoverySeconds());
        // disturbance energy of the held step: w^2 (T - start) exactly
        assertEquals(w * Math.sqrt(1.0 - 0.01), r.disturbanceEnergy(), 1e-9);
        // integral of x1^2: Van Loan value vs a trapezoid on the fine grid (independent route)
        double[] t = r.trajectory().timeSeconds();
        double trapezoid = 0;
        for (int i = 1; i < t.length; i++) {
            trapezoid += 0.5 * (t[i] - t[i - 1]) * (x1[i] * x1[i] + x1[i - 1] * x1[i - 1]);
        }
        assertEquals(trapezoid, r.integralSquaredError(), 1e-6 * trapezoid);
    }

    @Test
    void pulseRecoversToZero() {
        DisturbanceResponse r = simulator.simulate(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                new DisturbanceProfile.Pulse(0.1, 0.01, 0.02),
                IndexingAxis.performanceOutput(),
                1.0);
        double[] x1 = r.trajectory().x1();
        assertEquals(0, x1[x1.length - 1], 1e-5 * r.peakDeviation());
        assertTrue(r.recoverySeconds() > 0 && r.recoverySeconds() < 0.4);
    }
}
