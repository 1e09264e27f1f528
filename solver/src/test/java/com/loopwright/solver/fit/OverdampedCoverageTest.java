package com.loopwright.solver.fit;

import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.StepFit;
import com.loopwright.solver.plant.StepTestData;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Coverage of the 95% intervals for overdamped and near-critically damped plants with dead time, sampled at
 * non-uniform times (issue 12, item 13). Each record is synthetic: the textbook second-order step response
 * ({@link TextbookStep}) plus seeded Gaussian noise, 100 seeds per configuration. Every fit must reach the
 * optimum of an independent reference least-squares fit ({@link ReferenceStepFit}, started at the generating
 * parameters), and the intervals must contain the generating parameters at least 90% of the time.
 */
class OverdampedCoverageTest {

    private static final int SEEDS = 100;
    private static final String[] NAMES = {"gain", "naturalFrequency", "dampingRatio", "deadTime", "initialOffset"};

    /**
     * @param duration record length [s]; samples spaced uniformly at random in [0.5, 1.5] x duration/(n - 1)
     */
    private record Configuration(
            String name,
            double gain,
            double wn,
            double zeta,
            double deadTime,
            double offset,
            double stepTime,
            double duration,
            int n,
            double noise) {}

    private static StepTestData record(Configuration c, long seed) {
        Random random = new Random(seed);
        double[] t = new double[c.n()];
        double[] y = new double[c.n()];
        double mean = c.duration() / (c.n() - 1);
        for (int i = 0; i < c.n(); i++) {
            t[i] = i == 0 ? 0 : t[i - 1] + mean * (0.5 + random.nextDouble());
            y[i] = c.offset()
                    + c.gain() * TextbookStep.of(t[i] - c.stepTime() - c.deadTime(), c.wn(), c.zeta())
                    + c.noise() * random.nextGaussian();
        }
        return new StepTestData(t, y, c.stepTime(), 1);
    }

    @Test
    void intervalsCoverTheTruthAtTheStatedRateOnceTheFitReachesTheOptimum() {
        StepResponseFitter fitter = new StepResponseFitter();
        Configuration[] configurations = {
            // The plant of the issue: 41 samples over 10 s, stepped at t = 0.
            new Configuration("issue plant", 1, 2, 1.3, 0.1, 0.5, 0, 10, 41, 0.01),
            // Tank level loop: slow, strongly overdamped, transport delay.
            new Configuration("tank level", 0.5, 1.2, 2.0, 0.4, 0, 1, 15, 80, 0.005),
            // Just above critical damping, where the model passes its series form near zeta = 1.
            new Configuration("near critical", 2, 5, 1.05, 0.05, 0.2, 0.5, 4, 60, 0.01),
        };
        StringBuilder report = new StringBuilder();
        boolean allCovered = true;
        for (Configuration c : configurations) {
            int[] covered = new int[NAMES.length];
            for (long seed = 1; seed <= SEEDS; seed++) {
                StepTestData data = record(c, seed);
                StepFit fit = fitter.fit(data, new FitOptions(true, true));
                double[] truth = {c.gain(), c.wn(), c.zeta(), c.deadTime(), c.offset()};
                double reference = ReferenceStepFit.rmsError(data, truth);
                assertTrue(
                        fit.rmsError() <= 1.001 * reference,
                        c.name() + " seed " + seed + ": RMS " + fit.rmsError() + " vs reference " + reference);
                for (int i = 0; i < NAMES.length; i++) {
                    covered[i] += fit.parameter(NAMES[i]).covers(truth[i]) ? 1 : 0;
                }
            }
            int total = 0;
            report.append(c.name()).append(':');
            for (int i = 0; i < NAMES.length; i++) {
                total += covered[i];
                report.append(' ').append(NAMES[i]).append(' ').append(covered[i]);
                // Binomial: at a true 95% rate, 85 or fewer of 100 has probability below 0.1%.
                allCovered &= covered[i] > 85;
            }
            double rate = (double) total / (NAMES.length * SEEDS);
            report.append(String.format(" pooled %.3f%n", rate));
            allCovered &= rate >= 0.90;
        }
        assertTrue(allCovered, report.toString());
        System.out.print(report);
    }
}
