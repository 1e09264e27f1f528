package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.frequency.LoopFrequencyAnalyzer;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.IndexingAxis;
import org.junit.jupiter.api.Test;

class DelayedSampledStepSimulatorTest {

    private final DelayedSampledStepSimulator simulator = new DelayedSampledStepSimulator();

    @Test
    void sampledMetricsConvergeToTheContinuousOnesAsTsShrinks() {
        StepMetrics exact = new StepResponseMetrics()
                .measure(LinearLoop.ofStep(IndexingAxis.PLANT, IndexingAxis.GAINS), 1, 0.45, 4000, 0.02);
        double previousError = Double.POSITIVE_INFINITY;
        for (double ts : new double[] {2e-3, 5e-4, 1.25e-4, 3e-5}) {
            DenseTrajectory trajectory = simulator.simulate(IndexingAxis.PLANT, IndexingAxis.GAINS, 1, ts, 0, 0.45);
            GridMetrics m = GridMetrics.of(trajectory, 1, 0.02);
            double error = Math.abs(m.overshootPercent() - exact.overshootPercent())
                    + Math.abs(m.peakControl() - exact.peakControl());
            assertTrue(error < previousError, "error falls with Ts: " + error + " at Ts " + ts);
            previousError = error;
            if (ts == 3e-5) {
                assertEquals(exact.settlingTimeSeconds(), m.settlingTimeSeconds(), 2e-4);
                assertEquals(exact.overshootPercent(), m.overshootPercent(), 0.01);
                assertEquals(exact.riseTimeSeconds(), m.riseTimeSeconds(), 2e-4);
                assertEquals(exact.peakControl(), m.peakControl(), 1e-3);
            }
        }
    }

    @Test
    void fractionalDelayHoldsThePlantAtRestUntilTheDelayedInputArrives() {
        // The split hold: with a delay of 2.5 Ts the first control value reaches the plant at exactly 2.5 Ts,
        // so x1 is exactly 0 up to that instant (also at the intersample points) and positive right after it.
        double ts = 1e-3;
        DenseTrajectory delayed = simulator.simulate(IndexingAxis.PLANT, IndexingAxis.GAINS, 1, ts, 2.5 * ts, 0.05);
        double[] t = delayed.timeSeconds();
        double[] x1 = delayed.x1();
        for (int i = 0; i < t.length; i++) {
            if (t[i] <= 2.5 * ts + 1e-15) {
                assertEquals(0, x1[i], 0, "at " + t[i]);
            } else {
                assertTrue(x1[i] > 0, "at " + t[i]);
                break;
            }
        }
    }

    @Test
    void delayBelowTheMarginSettlesAndAboveItGrows() {
        // 1/(s(s + 1)) with unit feedback: delay margin 1.1506 s (hand computed: PM 51.83 deg at 0.7862 rad/s).
        CanonicalPlant plant = new CanonicalPlant(0, 1, 1, 0);
        FeedbackGains gains = new FeedbackGains(1, 0, 1);
        double margin = new LoopFrequencyAnalyzer().margins(plant, gains, 0).delayMarginSeconds();
        assertEquals(
                Math.toRadians(90 - Math.toDegrees(Math.atan(0.7861513777574233))) / 0.7861513777574233, margin, 1e-9);
        double ts = 1e-3;
        DenseTrajectory below = simulator.simulate(plant, gains, 1, ts, 0.9 * margin, 150);
        DenseTrajectory above = simulator.simulate(plant, gains, 1, ts, 1.1 * margin, 150);
        GridMetrics settled = GridMetrics.of(below, 1, 0.02);
        assertNotNull(settled.settlingTimeSeconds());
        assertNull(GridMetrics.of(above, 1, 0.02).settlingTimeSeconds());
        double[] x = above.x1();
        double lateSwing = 0;
        double earlySwing = 0;
        for (int i = 0; i < x.length; i++) {
            if (i < x.length / 3) {
                earlySwing = Math.max(earlySwing, Math.abs(x[i] - 1));
            } else if (i > 2 * x.length / 3) {
                lateSwing = Math.max(lateSwing, Math.abs(x[i] - 1));
            }
        }
        assertTrue(lateSwing > earlySwing, "oscillation grows beyond the delay margin");
    }
}
