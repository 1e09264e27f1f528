package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.FrequencyPoint;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.frequency.LoopFrequencyAnalyzer;
import com.loopwright.solver.frequency.SecondOrderLoopResponse;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import org.junit.jupiter.api.Test;

class ClosedFormLoopMarginsTest {

    private final LoopFrequencyAnalyzer analyzer = new LoopFrequencyAnalyzer();

    /** L(s) = 1/(s (s + 1)): a0 = 0, a1 = 1, b = 1, k1 = 1, k2 = 0. */
    private static final CanonicalPlant UNIT_LAG = new CanonicalPlant(0, 1, 1, 0);

    private static final FeedbackGains UNIT_GAIN = new FeedbackGains(1, 0, 1);

    @Test
    void textbookLoopMarginsMatchHandComputedValues() {
        // Unity feedback around 1/(s(s + 1)), the classic textbook loop (e.g. Ogata, Modern Control
        // Engineering, frequency-response chapter). By hand: |L| = 1 gives w^4 + w^2 - 1 = 0, so
        // wc = sqrt((sqrt 5 - 1)/2) = 0.78615 rad/s; PM = 180 - 90 - atan(wc) = 51.827 deg; the phase never
        // reaches -180, so the gain margin is unbounded.
        LoopMargins margins = analyzer.margins(UNIT_LAG, UNIT_GAIN, 0);
        double wc = Math.sqrt((Math.sqrt(5) - 1) / 2);
        assertEquals(0.786151, wc, 1e-6);
        assertEquals(wc, margins.crossoverRadPerSec(), 1e-12);
        assertEquals(90 - Math.toDegrees(Math.atan(wc)), margins.phaseMarginDegrees(), 1e-9);
        assertEquals(51.827, margins.phaseMarginDegrees(), 1e-3);
        assertNull(margins.gainMargin());
        assertTrue(margins.gainMarginUnbounded());
        assertNull(margins.gainReductionMargin());
    }

    /**
     * A second-order plant under state feedback with k1, k2, b &gt; 0: L(jw) = b (k1 + j k2 w)/(a0 - w^2 + j a1 w)
     * has one zero and two poles (relative degree 1), so its phase tends to -90 deg and never reaches -180 deg
     * (the textbook relative-degree argument, e.g. Franklin, Powell and Emami-Naeini, Feedback Control of Dynamic
     * Systems, Bode/Nyquist chapters): the gain margin is unbounded. Independent check (Routh-Hurwitz): with the
     * gain scaled by g the closed loop s^2 + (a1 + g b k2) s + (a0 + g b k1) has positive coefficients for every
     * g &gt; 0, here up to g = 1e6.
     */
    @Test
    void stateFeedbackOnAnAxisHasAnUnboundedGainMargin() {
        LoopMargins margins = analyzer.margins(IndexingAxis.PLANT, IndexingAxis.GAINS, 0);
        assertTrue(margins.gainMarginUnbounded());
        assertNull(margins.gainMargin());
        assertNull(margins.gainMarginRadPerSec());
        FeedbackGains k = IndexingAxis.GAINS;
        for (double g = 1; g <= 1e6; g *= 10) {
            FeedbackGains scaled = new FeedbackGains(g * k.positionGain(), g * k.velocityGain(), k.referenceGain());
            assertTrue(LoopMatrices.stable(IndexingAxis.PLANT, scaled), "stable at gain factor " + g);
        }
    }

    /**
     * A finite gain margin: a0 = 1, a1 = 3, b = 1, k1 = 1, k2 = -1 (velocity fed back with the wrong sign, stable
     * because of the plant's own damping). By hand: Im L = 0 at w^2 = a0 - k1 a1/k2 = 4, where
     * L(2j) = (1 - 2j)/(-3 + 6j) = -1/3, so the gain may grow by 3 before instability. Independent check
     * (Routh-Hurwitz): with the gains scaled by g the closed loop is s^2 + (3 - g) s + (1 + g), whose damping
     * coefficient vanishes at g = 3 exactly.
     */
    @Test
    void negativeVelocityFeedbackHasAFiniteGainMarginOfThree() {
        CanonicalPlant plant = new CanonicalPlant(1, 3, 1, 1);
        FeedbackGains gains = new FeedbackGains(1, -1, 1);
        LoopMargins margins = analyzer.margins(plant, gains, 0);
        assertFalse(margins.gainMarginUnbounded());
        assertEquals(3, margins.gainMargin(), 1e-12);
        assertEquals(2, margins.gainMarginRadPerSec(), 1e-12);
        double[] l = SecondOrderLoopResponse.loop(plant, gains, 2);
        assertEquals(-1.0 / 3, l[0], 1e-14);
        assertEquals(0, l[1], 1e-14);
        assertEquals(0, LoopMatrices.closedLoopDamping(plant, new FeedbackGains(3, -3, 1)), 0);
        assertTrue(LoopMatrices.stable(plant, new FeedbackGains(2.99, -2.99, 1)));
        assertFalse(LoopMatrices.stable(plant, new FeedbackGains(3.01, -3.01, 1)));
    }

    @Test
    void delayMarginIsPhaseMarginOverCrossover() {
        for (FeedbackGains gains : new FeedbackGains[] {UNIT_GAIN, IndexingAxis.GAINS}) {
            CanonicalPlant plant = gains == UNIT_GAIN ? UNIT_LAG : IndexingAxis.PLANT;
            LoopMargins margins = analyzer.margins(plant, gains, 0);
            assertEquals(
                    Math.toRadians(margins.phaseMarginDegrees()) / margins.crossoverRadPerSec(),
                    margins.delayMarginSeconds(),
                    1e-15 * margins.delayMarginSeconds());
            // independent route: |L(j wc)| = 1 by direct evaluation
            double[] l = SecondOrderLoopResponse.loop(plant, gains, margins.crossoverRadPerSec());
            assertEquals(1, Math.hypot(l[0], l[1]), 1e-12);
        }
    }

    @Test
    void gainReductionMarginOfANegativelyDampedPlantIsOneHalf() {
        // a0 = 4, a1 = -1, b = 1, k1 = 1, k2 = 2. By hand: Im L = 0 at w^2 = a0 - k1 a1/k2 = 4.5, where
        // L = (1 + 2jw)/(-0.5 - jw) = -2 exactly, so the gain may shrink to 1/2. Independent check (Routh-Hurwitz):
        // halving the gains gives c1 = a1 + b k2 / 2 = 0, the stability boundary.
        CanonicalPlant plant = new CanonicalPlant(4, -1, 1, 0);
        FeedbackGains gains = new FeedbackGains(1, 2, 1);
        LoopMargins margins = analyzer.margins(plant, gains, 0);
        assertEquals(0.5, margins.gainReductionMargin(), 1e-12);
        assertEquals(0, LoopMatrices.closedLoopDamping(plant, new FeedbackGains(0.5, 1, 1)), 0);
    }

    /**
     * Regression (issue 12, item 7): loops that cross 0 dB twice. POST /v1/designs with a0 10, a1 2, b 75, d 6,
     * overshoot 0.2%, settling 1.35 s gave these gains and reported phase margin -131.24 deg and delay margin 0.
     * The crossovers are 1.8119 rad/s (|L| rising, 180 + arg L = -131.24 deg, first reached by a delay of
     * 228.76 deg / w = 2.20 s) and 5.4385 rad/s (114.69 deg, 0.3681 s). Likewise the open-loop unstable plant
     * a0 150, a1 -1, b 65 (overshoot 2.66%, settling 0.37 s): 4.169 rad/s (231.37 deg, 0.969 s) and 29.47 rad/s
     * (80.78 deg, 47.84 ms). Expected crossovers from numpy on a 2e6-point log grid; reference for the delay
     * margin: the argument principle on the exact delayed characteristic function (DelayedLoopRoots), stable just
     * below the margin and with a right-half-plane pair just above it.
     */
    @Test
    void everyCrossoverCountsForPhaseAndDelayMargins() {
        record Case(
                CanonicalPlant plant, FeedbackGains gains, double crossover, double phaseMargin, double delayMargin) {}
        for (Case c : new Case[] {
            new Case(
                    new CanonicalPlant(10, 2, 75, 6),
                    new FeedbackGains(0.02270865497444023, 0.05474815300409212, 0.15604198830777358),
                    5.43846,
                    114.695,
                    0.368081),
            new Case(
                    new CanonicalPlant(150, -1, 65, 6),
                    new FeedbackGains(1.3238037013361184, 0.3727054578964097, 3.631496009028426),
                    29.4703,
                    80.7789,
                    0.0478400)
        }) {
            LoopMargins margins = analyzer.margins(c.plant(), c.gains(), 0);
            assertEquals(c.crossover(), margins.crossoverRadPerSec(), 1e-4 * c.crossover());
            assertEquals(c.phaseMargin(), margins.phaseMarginDegrees(), 2e-3);
            assertEquals(c.delayMargin(), margins.delayMarginSeconds(), 2e-5 * c.delayMargin());
            double tau = margins.delayMarginSeconds();
            assertEquals(0, DelayedLoopRoots.rightHalfPlaneZeros(c.plant(), c.gains(), 0));
            assertEquals(0, DelayedLoopRoots.rightHalfPlaneZeros(c.plant(), c.gains(), 0.98 * tau));
            assertEquals(2, DelayedLoopRoots.rightHalfPlaneZeros(c.plant(), c.gains(), 1.02 * tau));
        }
        // the simulations: the first loop is stable with 0.30 s of delay and diverges with 0.38 s
        CanonicalPlant plant = new CanonicalPlant(10, 2, 75, 6);
        FeedbackGains gains = new FeedbackGains(0.02270865497444023, 0.05474815300409212, 0.15604198830777358);
        assertEquals(0, DelayedLoopRoots.rightHalfPlaneZeros(plant, gains, 0.30));
        assertEquals(2, DelayedLoopRoots.rightHalfPlaneZeros(plant, gains, 0.38));
    }

    @Test
    void bandwidthMatchesTheSecondOrderFormula() {
        // wb = wn sqrt(1 - 2 zeta^2 + sqrt(4 zeta^4 - 4 zeta^2 + 2)) for wn^2/(s^2 + 2 zeta wn s + wn^2)
        // (Ogata, Modern Control Engineering, second-order bandwidth).
        double c0 = LoopMatrices.closedLoopStiffness(IndexingAxis.PLANT, IndexingAxis.GAINS);
        double c1 = LoopMatrices.closedLoopDamping(IndexingAxis.PLANT, IndexingAxis.GAINS);
        double wn = Math.sqrt(c0);
        double zeta = c1 / (2 * wn);
        double expected = wn * Math.sqrt(1 - 2 * zeta * zeta + Math.sqrt(4 * Math.pow(zeta, 4) - 4 * zeta * zeta + 2));
        LoopMargins margins = analyzer.margins(IndexingAxis.PLANT, IndexingAxis.GAINS, 0);
        assertEquals(expected, margins.bandwidthRadPerSec(), 1e-10 * expected);
        double[] t = SecondOrderLoopResponse.closedLoop(IndexingAxis.PLANT, IndexingAxis.GAINS, expected);
        assertEquals(1 / Math.sqrt(2), Math.hypot(t[0], t[1]), 1e-10);
    }

    @Test
    void marginsAgreeWithADenseBruteForceScan() {
        LoopMargins margins = analyzer.margins(IndexingAxis.PLANT, IndexingAxis.GAINS, 0);
        double bestS = 0;
        double crossing = Double.NaN;
        double previous = Double.NaN;
        for (int i = 0; i <= 400_000; i++) {
            double w = Math.pow(10, -2 + 6.0 * i / 400_000);
            bestS = Math.max(bestS, SecondOrderLoopResponse.sensitivity(IndexingAxis.PLANT, IndexingAxis.GAINS, w));
            double[] l = SecondOrderLoopResponse.loop(IndexingAxis.PLANT, IndexingAxis.GAINS, w);
            double gain = Math.hypot(l[0], l[1]);
            if (!Double.isNaN(previous) && previous >= 1 && gain < 1) {
                crossing = w;
            }
            previous = gain;
        }
        // |S| < 1 on the whole scan here, so the supremum is the high-frequency limit 1 (L strictly proper)
        assertEquals(Math.max(1, bestS), margins.peakSensitivity(), 1e-8);
        assertTrue(margins.peakSensitivity() >= bestS);
        // a loop that peaks: 1/(s(s + 1)) with unit feedback, against the same brute-force scan
        LoopMargins lag = analyzer.margins(UNIT_LAG, UNIT_GAIN, 0);
        double lagBest = 0;
        for (int i = 0; i <= 400_000; i++) {
            lagBest = Math.max(
                    lagBest,
                    SecondOrderLoopResponse.sensitivity(UNIT_LAG, UNIT_GAIN, Math.pow(10, -2 + 4.0 * i / 400_000)));
        }
        assertTrue(lagBest > 1);
        assertEquals(lagBest, lag.peakSensitivity(), 1e-9);
        assertTrue(lag.peakSensitivity() >= lagBest);
        assertEquals(crossing, margins.crossoverRadPerSec(), 1e-4 * crossing);
    }

    @Test
    void responseIsLogSpacedCappedAndPhaseContinuous() {
        LoopMargins margins = analyzer.margins(IndexingAxis.PLANT, IndexingAxis.GAINS, 50);
        assertEquals(50, margins.response().size());
        double ratio = margins.response().get(1).frequencyRadPerSec()
                / margins.response().get(0).frequencyRadPerSec();
        for (int i = 1; i < 50; i++) {
            FrequencyPoint a = margins.response().get(i - 1);
            FrequencyPoint b = margins.response().get(i);
            assertEquals(ratio, b.frequencyRadPerSec() / a.frequencyRadPerSec(), 1e-9 * ratio);
            assertTrue(Math.abs(b.loopPhaseDegrees() - a.loopPhaseDegrees()) < 180);
        }
        org.junit.jupiter.api.Assertions.assertThrows(
                IllegalArgumentException.class,
                () -> analyzer.margins(
                        IndexingAxis.PLANT, IndexingAxis.GAINS, LoopFrequencyAnalyzer.MAX_RESPONSE_POINTS + 1));
    }
}
