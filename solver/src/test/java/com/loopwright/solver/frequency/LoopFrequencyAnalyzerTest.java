package com.loopwright.solver.frequency;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.BodeSeries;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.plant.CanonicalPlant;
import org.hipparchus.complex.Complex;
import org.hipparchus.linear.Array2DRowFieldMatrix;
import org.hipparchus.linear.ArrayFieldVector;
import org.hipparchus.linear.FieldLUDecomposition;
import org.hipparchus.linear.FieldMatrix;
import org.hipparchus.linear.FieldVector;
import org.junit.jupiter.api.Test;

class LoopFrequencyAnalyzerTest {

    private final LoopFrequencyAnalyzer analyzer = new LoopFrequencyAnalyzer();

    /**
     * Textbook loop L(s) = K / (s (s + 1)(s + 2)) (the standard third-order example in e.g. Ogata, Modern
     * Control Engineering, chapter on frequency response). Hand computation: the phase -90 - atan w - atan(w/2)
     * reaches -180 where atan w + atan(w/2) = 90 deg, i.e. w^2 / 2 = 1, w = sqrt 2, and there
     * |L| = K / (sqrt2 sqrt3 sqrt6) = K / 6, so GM = 6 / K (K = 2: GM = 3 = 9.542 dB).
     */
    @Test
    void textbookThirdOrderLoopGainMargin() {
        RationalLoop loop = new RationalLoop(new double[] {2}, new double[] {0, 2, 3, 1});
        GridStabilityMargins.Margins margins = GridStabilityMargins.of(loop, 1e-2, 1e2, 400);
        assertEquals(Math.sqrt(2), margins.phaseCrossoverRadPerSec().getAsDouble(), 1e-12);
        assertEquals(20 * Math.log10(3), margins.gainMarginDecibels().getAsDouble(), 1e-10);
    }

    /**
     * Same loop, gain crossover by hand: |L| = 1 means w^2 (w^2 + 1)(w^2 + 4) = 4, a cubic in x = w^2,
     * x^3 + 5 x^2 + 4 x - 4 = 0, with one positive root x = 0.5616 (w = 0.749); the phase margin is
     * 90 - atan w - atan(w/2) = 32.6 deg. Independent route here: the cubic's root by Newton iteration.
     */
    @Test
    void textbookThirdOrderLoopPhaseMargin() {
        double x = 0.5;
        for (int i = 0; i < 50; i++) {
            x -= (x * x * x + 5 * x * x + 4 * x - 4) / (3 * x * x + 10 * x + 4);
        }
        double crossover = Math.sqrt(x);
        double expectedMargin = 90 - Math.toDegrees(Math.atan(crossover) + Math.atan(crossover / 2));
        RationalLoop loop = new RationalLoop(new double[] {2}, new double[] {0, 2, 3, 1});
        GridStabilityMargins.Margins margins = GridStabilityMargins.of(loop, 1e-2, 1e2, 400);
        assertEquals(crossover, margins.gainCrossoverRadPerSec().getAsDouble(), 1e-12);
        assertEquals(expectedMargin, margins.phaseMarginDegrees().getAsDouble(), 1e-9);
        assertEquals(32.6, margins.phaseMarginDegrees().getAsDouble(), 0.05); // hand value above
    }

    /**
     * The indexing-axis design (README): L = b (k1 + k2 s) / (s^2 + a1 s), phase in (-180, -90): no phase
     * crossover, so no finite gain margin; the phase margin must equal the closed form at the crossover.
     * Independent route: L(jw) = K (jwI - A)^-1 B by a complex linear solve in Hipparchus.
     */
    @Test
    void stateFeedbackLoopMatchesMatrixRouteAndHasNoPhaseCrossover() {
        CanonicalPlant plant = new CanonicalPlant(0, 0.48, 400, 400);
        double k1 = 1.57230;
        double k2 = 0.0992069;
        RationalLoop loop = RationalLoop.atPlantInput(plant, k1, k2);
        for (double w : new double[] {0.1, 1, 10, 25, 100, 1000}) {
            double[] polynomial = loop.at(w);
            double[] matrix = matrixRoute(plant, k1, k2, w);
            assertEquals(matrix[0], polynomial[0], 1e-12 * Math.hypot(matrix[0], matrix[1]));
            assertEquals(matrix[1], polynomial[1], 1e-12 * Math.hypot(matrix[0], matrix[1]));
        }
        GridStabilityMargins.Margins margins = GridStabilityMargins.of(loop, 0.1, 1e4, 500);
        assertFalse(margins.phaseCrossoverRadPerSec().isPresent());
        assertFalse(margins.gainMarginDecibels().isPresent());
        double wc = margins.gainCrossoverRadPerSec().getAsDouble();
        double[] l = loop.at(wc);
        assertEquals(1, Math.hypot(l[0], l[1]), 1e-12);
        double phase = Math.toDegrees(Math.atan(k2 * wc / k1) - Math.PI / 2 - Math.atan(wc / 0.48));
        assertEquals(180 + phase, margins.phaseMarginDegrees().getAsDouble(), 1e-9);
        assertTrue(margins.phaseMarginDegrees().getAsDouble() > 60);
    }

    /**
     * Regression (issue 12, item 7): loops crossing 0 dB twice (the two designs). The grid search with
     * Brent refinement finds both crossovers and agrees with the closed-form analyzer of /v1/verifications (the
     * crossovers from the quadratic in w^2); expected values from numpy on a 2e6-point log grid: delay margins
     * 0.36808 s and 47.840 ms, set by the crossovers at 5.4385 and 29.470 rad/s.
     */
    @Test
    void twoCrossoverLoopsAgreeWithTheClosedFormAnalyzer() {
        CanonicalPlant[] plants = {new CanonicalPlant(10, 2, 75, 6), new CanonicalPlant(150, -1, 65, 6)};
        FeedbackGains[] gains = {
            new FeedbackGains(0.02270865497444023, 0.05474815300409212, 0.15604198830777358),
            new FeedbackGains(1.3238037013361184, 0.3727054578964097, 3.631496009028426)
        };
        double[] delays = {0.368081, 0.0478400};
        for (int i = 0; i < plants.length; i++) {
            RationalLoop loop = RationalLoop.atPlantInput(plants[i], gains[i].positionGain(), gains[i].velocityGain());
            assertTrue(loop.closedLoopStable());
            GridStabilityMargins.Margins grid = GridStabilityMargins.of(loop, 1e-2, 1e3, 400);
            LoopMargins closedForm = analyzer.margins(plants[i], gains[i], 0);
            assertEquals(
                    closedForm.crossoverRadPerSec(),
                    grid.gainCrossoverRadPerSec().getAsDouble(),
                    1e-12 * closedForm.crossoverRadPerSec());
            assertEquals(
                    closedForm.phaseMarginDegrees(), grid.phaseMarginDegrees().getAsDouble(), 1e-9);
            assertEquals(
                    closedForm.delayMarginSeconds(), grid.delayMarginSeconds().getAsDouble(), 1e-12);
            assertEquals(delays[i], grid.delayMarginSeconds().getAsDouble(), 2e-5 * delays[i]);
        }
        // an unstable closed loop (gain 10 around 1/(s(s+1)(s+2)), Routh: unstable above 6) has no delay margin
        RationalLoop unstable = new RationalLoop(new double[] {10}, new double[] {0, 2, 3, 1});
        assertFalse(unstable.closedLoopStable());
        assertEquals(
                0,
                GridStabilityMargins.of(unstable, 1e-2, 1e2, 400)
                        .delayMarginSeconds()
                        .getAsDouble());
    }

    /** Unwrapped phase of 1/(s+1)^4 runs continuously from 0 to near -360 (common practice). */
    @Test
    void phaseIsUnwrappedAlongTheGrid() {
        RationalLoop loop = new RationalLoop(new double[] {1}, new double[] {1, 4, 6, 4, 1});
        BodeSeries bode = analyzer.sample(loop, 1e-3, 1e3, 300);
        double[] phase = bode.phaseDegrees();
        for (int i = 1; i < phase.length; i++) {
            assertTrue(phase[i] <= phase[i - 1] + 1e-9);
            assertTrue(phase[i - 1] - phase[i] < 30);
        }
        assertEquals(-4 * Math.toDegrees(Math.atan(1e3)), phase[phase.length - 1], 1e-6);
        assertEquals(-20 * Math.log10(Math.pow(1 + 1e6, 2)), bode.magnitudeDecibels()[phase.length - 1], 1e-6);
    }

    @Test
    void capsAndBadWindowsAreRejected() {
        RationalLoop loop = new RationalLoop(new double[] {1}, new double[] {1, 1});
        assertThrows(IllegalArgumentException.class, () -> analyzer.sample(loop, 0, 1, 10));
        assertThrows(IllegalArgumentException.class, () -> analyzer.sample(loop, 1, 1, 10));
        assertThrows(
                IllegalArgumentException.class,
                () -> analyzer.sample(loop, 1, 10, LoopFrequencyAnalyzer.MAX_POINTS + 1));
        assertThrows(IllegalArgumentException.class, () -> new RationalLoop(new double[] {0}, new double[] {1}));
        assertThrows(IllegalArgumentException.class, () -> new RationalLoop(new double[] {1}, new double[] {1, 0}));
    }

    private static double[] matrixRoute(CanonicalPlant plant, double k1, double k2, double w) {
        // (jw I - A) v = B by Hipparchus' complex LU, then L = K v.
        FieldMatrix<Complex> m = new Array2DRowFieldMatrix<>(new Complex[][] {
            {new Complex(0, w), new Complex(-1, 0)},
            {new Complex(plant.a0(), 0), new Complex(plant.a1(), w)}
        });
        FieldVector<Complex> rhs = new ArrayFieldVector<>(new Complex[] {Complex.ZERO, new Complex(plant.b(), 0)});
        FieldVector<Complex> v = new FieldLUDecomposition<>(m).getSolver().solve(rhs);
        Complex l = v.getEntry(0).multiply(k1).add(v.getEntry(1).multiply(k2));
        return new double[] {l.getReal(), l.getImaginary()};
    }
}
