package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.robustness.IndexingAxis;
import org.junit.jupiter.api.Test;

class SaturatedStepSimulatorTest {

    private final SaturatedStepSimulator simulator = new SaturatedStepSimulator();
    private final StepMetrics exact = new StepResponseMetrics()
            .measure(LinearLoop.ofStep(IndexingAxis.PLANT, IndexingAxis.GAINS), 1, 0.45, 4000, 0.02);

    @Test
    void withoutActiveLimitTheGridMetricsMatchTheExactOnes() {
        DenseTrajectory t =
                simulator.simulate(IndexingAxis.PLANT, IndexingAxis.GAINS, 1, Double.POSITIVE_INFINITY, 0.45);
        GridMetrics m = GridMetrics.of(t, 1, 0.02);
        assertEquals(exact.settlingTimeSeconds(), m.settlingTimeSeconds(), 1e-6);
        assertEquals(exact.riseTimeSeconds(), m.riseTimeSeconds(), 1e-6);
        assertEquals(exact.overshootPercent(), m.overshootPercent(), 1e-4);
        assertEquals(exact.peakControl(), m.peakControl(), 1e-12);
    }

    @Test
    void largestUnsaturatedStepJustTouchesTheLimit() {
        // peak |u| is linear in the step size, so step = limit / peak(unit step) reaches the limit exactly
        double limit = 1.0;
        double step = limit / exact.peakControl();
        DenseTrajectory t = simulator.simulate(IndexingAxis.PLANT, IndexingAxis.GAINS, step, limit, 0.45);
        GridMetrics m = GridMetrics.of(t, step, 0.02);
        assertEquals(limit, m.peakControl(), 1e-12);
        assertEquals(exact.settlingTimeSeconds(), m.settlingTimeSeconds(), 1e-6);
    }

    @Test
    void saturationSlowsTheStepAndClampsTheControl() {
        double limit = 0.5;
        DenseTrajectory t = simulator.simulate(IndexingAxis.PLANT, IndexingAxis.GAINS, 1, limit, 1.2);
        GridMetrics m = GridMetrics.of(t, 1, 0.02);
        assertEquals(limit, m.peakControl(), 0);
        assertTrue(m.riseTimeSeconds() > exact.riseTimeSeconds());
        // during the first saturated phase u = limit and x1'' = -a1 x1' + b limit exactly
        double[] x2 = t.x2();
        double[] time = t.timeSeconds();
        double a1 = IndexingAxis.PLANT.a1();
        double expected = IndexingAxis.PLANT.b() * limit / a1 * (1 - Math.exp(-a1 * time[10]));
        assertEquals(expected, x2[10], 1e-9 * expected);
    }
}
