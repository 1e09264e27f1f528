package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.cancel.ComputationCancelledException;
import com.loopwright.solver.fit.StepResponseFitter;
import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.StepTestData;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

/**
 * The long loops stop at their cancellation checkpoint once their thread is interrupted (how the service cancels a
 * computation past its deadline), and leave the interrupt flag set for the layers above.
 */
class CancellationCheckpointTest {

    private static final AcceptanceLimits LIMITS = new AcceptanceLimits(0.165, null, 1.65, 0.02);
    /** The indexing axis with a1, b and d +-10 %. */
    private static final ParameterBox BOX = new ParameterBox(0, 0, 0.432, 0.528, 360, 440, 360, 440);

    @AfterEach
    void clearInterrupt() {
        Thread.interrupted();
    }

    private static RobustnessOptions monteCarlo(int samples) {
        return new RobustnessOptions(BOX, samples, 1, List.of(), null, null, false, null, 0, 0);
    }

    @Test
    void monteCarloSamplesStopOnAnInterruptedThread() {
        RobustnessVerifier verifier = new RobustnessVerifier();
        // Not interrupted: the 20 samples (and 16 corners) are all evaluated.
        RobustnessReport report = verifier.verify(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                1,
                LIMITS,
                IndexingAxis.performanceOutput(),
                IndexingAxis.DESIGN.gamma(),
                monteCarlo(20));
        assertEquals(20, report.uncertainty().sampleCount());
        Thread.currentThread().interrupt();
        assertThrows(
                ComputationCancelledException.class,
                () -> verifier.verify(
                        IndexingAxis.PLANT,
                        IndexingAxis.GAINS,
                        1,
                        LIMITS,
                        IndexingAxis.performanceOutput(),
                        IndexingAxis.DESIGN.gamma(),
                        monteCarlo(2000)));
        assertTrue(Thread.interrupted(), "the interrupt flag is read, not cleared");
    }

    @Test
    void aStepFitStopsOnAnInterruptedThread() {
        // y = 2 (1 - e^(-2 t') (cos 3t' + (2/3) sin 3t')), t' = t - 1 - 0.2: a second-order step with dead time
        // 0.2 s (the underdamped unit step response, e.g. Ogata 5-3).
        int n = 2000;
        double[] t = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.002;
            double late = Math.max(0, t[i] - 1.2);
            y[i] = late == 0 ? 0 : 2 * (1 - Math.exp(-2 * late) * (Math.cos(3 * late) + 2.0 / 3 * Math.sin(3 * late)));
        }
        StepTestData data = new StepTestData(t, y, 1, 1);
        Thread.currentThread().interrupt();
        assertThrows(
                ComputationCancelledException.class,
                () -> new StepResponseFitter().fit(data, new FitOptions(true, true)));
    }
}
