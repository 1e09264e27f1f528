package com.loopwright.solver.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.FitWarning;
import com.loopwright.solver.plant.FittedParameter;
import com.loopwright.solver.plant.StepFit;
import com.loopwright.solver.plant.StepTestData;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Fits at and near the dead-time bound and at a singular J'J (issue 12, items 11 and 12). The records are
 * synthetic: the textbook second-order step response ({@link TextbookStep}) plus seeded Gaussian noise. The
 * reference optimum is an independent least-squares fit ({@link ReferenceStepFit}: textbook formulas,
 * difference Jacobian, Hipparchus Levenberg-Marquardt started at the generating parameters).
 */
class DeadTimeBoundTest {

    private final StepResponseFitter fitter = new StepResponseFitter();

    /** 41 samples 0.25 s apart from t = 0, stepped at t = 0: y = y0 + K S(t - theta) + noise. */
    private static StepTestData record(
            double gain,
            double wn,
            double zeta,
            double theta,
            double y0,
            double noise,
            double spacing,
            double stepTime,
            long seed) {
        Random random = new Random(seed);
        int n = 41;
        double[] t = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = spacing * i;
            y[i] = y0 + gain * TextbookStep.of(t[i] - stepTime - theta, wn, zeta) + noise * random.nextGaussian();
        }
        return new StepTestData(t, y, stepTime, 1);
    }

    // Issue 12 item 11: truth K 1, wn 2, zeta 1.3, dead time 0.1, offset 0.5, 1% noise, 41 samples. A start at
    // dead time 0 stalled there with zeta 0.80, wn 1.0 and RMS 0.051, five times the optimum's.
    @Test
    void anOverdampedPlantWithDeadTimeIsNotStuckAtDeadTimeZero() {
        StepTestData data = record(1, 2, 1.3, 0.1, 0.5, 0.01, 0.25, 0, 10);
        StepFit fit = fitter.fit(data, new FitOptions(true, true));
        double reference = ReferenceStepFit.rmsError(data, new double[] {1, 2, 1.3, 0.1, 0.5});
        assertTrue(fit.rmsError() <= 1.05 * reference, fit.rmsError() + " vs reference " + reference);
        assertTrue(fit.dampingRatio() > 1, "overdamped: " + fit.dampingRatio());
        assertTrue(fit.deadTimeSeconds() > 0, "dead time " + fit.deadTimeSeconds());
        FittedParameter deadTime = fit.parameter("deadTime");
        assertTrue(deadTime.lower95() >= 0, deadTime.toString());
        assertTrue(deadTime.covers(0.1), deadTime.toString());
        assertTrue(
                fit.parameter("dampingRatio").covers(1.3),
                fit.parameter("dampingRatio").toString());
        assertTrue(
                fit.parameter("naturalFrequency").covers(2),
                fit.parameter("naturalFrequency").toString());
    }

    // A plant without delay fitted with a dead time: the optimum wants a negative dead time, so it sits on
    // the bound 0; the interval is one-sided and the fit says so.
    @Test
    void aFitOnTheDeadTimeBoundWarnsAndKeepsItsIntervalAtOrAboveZero() {
        int onBound = 0;
        for (long seed = 1; seed <= 10; seed++) {
            StepTestData data = record(1, 2, 1.3, 0, 0.5, 0.01, 0.25, 0, seed);
            StepFit fit = fitter.fit(data, new FitOptions(true, true));
            FittedParameter deadTime = fit.parameter("deadTime");
            assertTrue(deadTime.lower95() >= 0 && deadTime.upper95() > deadTime.lower95(), deadTime.toString());
            double reference = ReferenceStepFit.rmsError(data, new double[] {1, 2, 1.3, 0, 0.5});
            assertTrue(fit.rmsError() <= 1.001 * reference, fit.rmsError() + " vs reference " + reference);
            boolean warned = fit.warnings().stream()
                    .anyMatch(w ->
                            w.code() == FitWarning.Code.AT_BOUND && w.message().startsWith("deadTime"));
            assertEquals(fit.deadTimeSeconds() == 0, warned, fit.warnings().toString());
            if (fit.deadTimeSeconds() == 0) {
                onBound++;
                assertEquals(0, deadTime.lower95());
                assertTrue(deadTime.covers(0));
            }
        }
        // With no true delay some unconstrained estimates are negative (1 of these 10 seeded records).
        assertTrue(onBound >= 1, onBound + " of 10 fits on the bound");
    }

    // Issue 12 item 12: a heavily overdamped fit (wn 33.9, zeta 9.46) sampled at 10 Hz: the fast pole at
    // wn (zeta + sqrt(zeta^2 - 1)) = 640 rad/s decays within a sample, and its only trace, the amplitude
    // factor 1 + p_slow/p_fast, is a dead-time shift of 1/p_fast to first order: J'J is singular there. On
    // this seeded record a single start used to report wn 94.6, zeta 26.9 and a dead time with standard
    // errors of exactly 0 and zero-width intervals.
    @Test
    void aSingularNormalMatrixGivesNoZeroStandardErrorAndNoUnsupportedInterval() {
        StepTestData data = record(1, 33.9, 9.46, 0.1, 0.5, 0.01, 0.1, 0.5, 5);
        StepFit fit = fitter.fit(data, new FitOptions(true, true));
        assertTrue(
                fit.warnings().stream().anyMatch(w -> w.code() == FitWarning.Code.POORLY_DETERMINED),
                fit.warnings().toString());
        int undetermined = 0;
        for (FittedParameter p : fit.parameters()) {
            if (p.determined()) {
                assertTrue(
                        p.standardError() > 0 && p.lower95() < p.estimate() && p.estimate() < p.upper95(),
                        p.toString());
            } else {
                undetermined++;
                assertTrue(Double.isNaN(p.lower95()) && Double.isNaN(p.upper95()), p.toString());
                assertTrue(
                        fit.warnings().stream()
                                .anyMatch(w -> w.code() == FitWarning.Code.POORLY_DETERMINED
                                        && w.message().startsWith(p.name())),
                        fit.warnings().toString());
            }
        }
        assertTrue(undetermined >= 2, fit.parameters().toString());
        // The slow pole wn (zeta - sqrt(zeta^2 - 1)) = 1.80 rad/s, which the samples do show, is determined.
        double slowPole =
                fit.naturalFrequency() * (fit.dampingRatio() - Math.sqrt(fit.dampingRatio() * fit.dampingRatio() - 1));
        assertEquals(1.80, slowPole, 0.1);
        assertTrue(fit.parameter("gain").determined() && fit.parameter("gain").covers(1));
    }
}
