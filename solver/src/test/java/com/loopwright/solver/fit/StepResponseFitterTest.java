package com.loopwright.solver.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.FitWarning;
import com.loopwright.solver.plant.StepFit;
import com.loopwright.solver.plant.StepTestData;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Fits of step responses generated from known models by the textbook formula, with seeded Gaussian noise:
 * the reported 95% intervals must cover the true parameters in at least 90% of the trials, a known dead time
 * must be recovered, and degenerate records must give a warning or a FitFailedException.
 */
class StepResponseFitterTest {

    private final StepResponseFitter fitter = new StepResponseFitter();

    /** Samples of y0 + K A S(wn (t - t_step - theta)) + noise on a uniform grid. */
    private static StepTestData generate(
            double gain,
            double wn,
            double zeta,
            double theta,
            double y0,
            double amplitude,
            double stepTime,
            double duration,
            int n,
            double noise,
            Random random) {
        double[] t = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = duration * i / (n - 1);
            y[i] = y0
                    + gain * amplitude * TextbookStep.of(t[i] - stepTime - theta, wn, zeta)
                    + noise * random.nextGaussian();
        }
        return new StepTestData(t, y, stepTime, amplitude);
    }

    private record Scenario(
            double gain,
            double wn,
            double zeta,
            double theta,
            double y0,
            double duration,
            int n,
            double noise,
            FitOptions options) {}

    // Conveyor speed loop, tank level, and a gimbal axis with transport delay: several noise levels and counts.
    @Test
    void confidenceIntervalsCoverTheTrueParametersAtTheStatedRate() {
        Scenario[] scenarios = {
            new Scenario(2.0, 5, 0.4, 0, 0.3, 4, 400, 0.01, new FitOptions(false, true)),
            new Scenario(0.5, 1.2, 1.3, 0, 0, 15, 1000, 0.01, new FitOptions(false, false)),
            new Scenario(1.5, 8, 0.6, 0.3, -0.2, 2.5, 250, 0.03, new FitOptions(true, true)),
            new Scenario(4.0, 20, 0.25, 0, 1.0, 1.5, 2000, 0.2, new FitOptions(false, true)),
        };
        int trialsPerScenario = 30;
        int covered = 0;
        int intervals = 0;
        Random random = new Random(8_2026_12_02L);
        for (Scenario s : scenarios) {
            for (int trial = 0; trial < trialsPerScenario; trial++) {
                StepTestData data = generate(
                        s.gain(),
                        s.wn(),
                        s.zeta(),
                        s.theta(),
                        s.y0(),
                        1,
                        0.1 * s.duration(),
                        s.duration(),
                        s.n(),
                        s.noise(),
                        random);
                StepFit fit = fitter.fit(data, s.options());
                assertTrue(fit.rSquared() > 0.9, "R^2 " + fit.rSquared());
                // source: for Gaussian noise of sigma, the RMS residual tends to sigma sqrt((n-p)/n).
                assertEquals(s.noise(), fit.rmsError(), 0.2 * s.noise());
                double[] truth = {s.gain(), s.wn(), s.zeta(), s.theta(), s.y0()};
                String[] names = {"gain", "naturalFrequency", "dampingRatio", "deadTime", "initialOffset"};
                for (int i = 0; i < names.length; i++) {
                    if (i == 3 && !s.options().estimateDeadTime()
                            || i == 4 && !s.options().estimateInitialOffset()) {
                        continue;
                    }
                    intervals++;
                    covered += fit.parameter(names[i]).covers(truth[i]) ? 1 : 0;
                }
            }
        }
        double rate = (double) covered / intervals;
        // The stated rate: at least 90% of the 95% intervals over the seeded trials.
        assertTrue(rate >= 0.90, "coverage " + rate + " over " + intervals + " intervals");
        assertTrue(rate <= 0.995, "intervals too wide: coverage " + rate);
    }

    @Test
    void recoversAKnownDeadTime() {
        // Packaging-line web tension loop with 0.25 s transport delay.
        StepTestData data = generate(1.2, 3, 0.7, 0.25, 0, 2, 0.5, 6, 600, 0.002, new Random(11));
        StepFit fit = fitter.fit(data, new FitOptions(true, true));
        assertEquals(0.25, fit.deadTimeSeconds(), 0.005);
        assertTrue(fit.parameter("deadTime").covers(0.25));
        assertEquals(3, fit.naturalFrequency(), 0.03);
        assertEquals(0.7, fit.dampingRatio(), 0.01);
        assertEquals(1.2, fit.gain(), 0.005);
        assertTrue(fit.warnings().stream().anyMatch(w -> w.code() == FitWarning.Code.DEAD_TIME_NOT_IN_DESIGN));
    }

    @Test
    void degenerateRecordsAreRefusedOrFlagged() {
        double[] t = new double[50];
        double[] flat = new double[50];
        for (int i = 0; i < 50; i++) {
            t[i] = 0.1 * i;
            flat[i] = 2.0;
        }
        assertThrows(
                FitFailedException.class,
                () -> fitter.fit(new StepTestData(t, flat, 0, 1), new FitOptions(false, true)));
        assertThrows(
                FitFailedException.class,
                () -> fitter.fit(
                        new StepTestData(new double[] {0, 1, 2, 3, 4}, new double[] {0, 1, 1, 1, 1}, 0, 1),
                        new FitOptions(false, true)));
        // Pure noise: the fitted change is buried in the noise.
        Random random = new Random(5);
        double[] noise = new double[200];
        double[] tn = new double[200];
        for (int i = 0; i < 200; i++) {
            tn[i] = 0.01 * i;
            noise[i] = random.nextGaussian();
        }
        FitFailedException buried = assertThrows(
                FitFailedException.class,
                () -> fitter.fit(new StepTestData(tn, noise, 0.5, 1), new FitOptions(false, true)));
        assertTrue(
                buried.getMessage().contains("noise")
                        || buried.getMessage().contains("converge")
                        || buried.getMessage().contains("identifiable"),
                buried.getMessage());

        // Clipped at a sensor limit of 1.1 while the true response overshoots to about 1.37.
        StepTestData raw = generate(1, 4, 0.3, 0, 0, 1, 0.2, 5, 500, 0.001, new Random(3));
        double[] clipped = raw.output();
        for (int i = 0; i < clipped.length; i++) {
            clipped[i] = Math.min(clipped[i], 1.1);
        }
        StepFit saturated =
                fitter.fit(new StepTestData(raw.timeSeconds(), clipped, 0.2, 1), new FitOptions(false, true));
        assertTrue(
                saturated.warnings().stream().anyMatch(w -> w.code() == FitWarning.Code.SATURATION_PLATEAU),
                saturated.warnings().toString());

        // A record that stops during the rise.
        StepTestData shortRecord = generate(1, 2, 0.8, 0, 0, 1, 0, 1.0, 100, 0.001, new Random(4));
        StepFit cut = fitter.fit(shortRecord, new FitOptions(false, false));
        assertTrue(
                cut.warnings().stream().anyMatch(w -> w.code() == FitWarning.Code.RECORD_TOO_SHORT),
                cut.warnings().toString());

        // Noisy: sigma 20% of the step.
        StepTestData noisy = generate(1, 3, 0.5, 0, 0, 1, 0.2, 6, 800, 0.2, new Random(6));
        StepFit loud = fitter.fit(noisy, new FitOptions(false, true));
        assertTrue(
                loud.warnings().stream().anyMatch(w -> w.code() == FitWarning.Code.NOISE_DOMINATES),
                loud.warnings().toString());
    }

    @Test
    void aFitThatRunsOutOfIterationsIsAFailureNotAResult() {
        // Heavy noise and a start far from the optimum: two iterations cannot converge.
        StepTestData data = generate(1, 3, 0.2, 0.4, 0, 1, 0.2, 6, 800, 0.05, new Random(9));
        FitFailedException failure = assertThrows(
                FitFailedException.class, () -> new StepResponseFitter(2).fit(data, new FitOptions(true, true)));
        assertTrue(failure.getMessage().contains("did not converge within 2 iterations"), failure.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new StepResponseFitter(0));
    }

    @Test
    void nonUniformSamplingIsFitLikeUniform() {
        Random random = new Random(21);
        int n = 300;
        double[] t = new double[n];
        double[] y = new double[n];
        double time = 0;
        for (int i = 0; i < n; i++) {
            time += 0.005 + 0.03 * random.nextDouble();
            t[i] = time;
            y[i] = 0.8 * TextbookStep.of(time - 0.1, 6, 0.35) + 0.002 * random.nextGaussian();
        }
        StepFit fit = fitter.fit(new StepTestData(t, y, 0.1, 1), new FitOptions(false, false));
        assertEquals(6, fit.naturalFrequency(), 0.05);
        assertEquals(0.35, fit.dampingRatio(), 0.005);
        assertEquals(0.8, fit.gain(), 0.003);
    }
}
