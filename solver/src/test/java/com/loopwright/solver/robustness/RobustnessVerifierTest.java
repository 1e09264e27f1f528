package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.DisturbanceProfile;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import java.util.List;
import org.junit.jupiter.api.Test;

class RobustnessVerifierTest {

    private final RobustnessVerifier verifier = new RobustnessVerifier();
    private static final AcceptanceLimits LIMITS = new AcceptanceLimits(0.165, null, 1.65, 0.02);

    private static RobustnessOptions options(Double ts, boolean search, Double delay) {
        return new RobustnessOptions(
                null,
                0,
                1,
                List.of(new DisturbanceProfile.BoundedRandom(1, 0.005, 3)),
                2.0,
                ts,
                search,
                delay,
                20,
                100);
    }

    @Test
    void everySectionOfTheIndexingAxisIsConsistent() {
        RobustnessReport report = verifier.verify(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                1,
                LIMITS,
                IndexingAxis.performanceOutput(),
                IndexingAxis.DESIGN.gamma(),
                options(1e-3, true, 2e-3));
        assertEquals(Verdict.MET, report.nominalMeetsSpec());
        assertTrue(report.hinfNorm() <= IndexingAxis.DESIGN.gamma());
        DisturbanceCheck check = report.disturbances().get(0);
        assertTrue(check.withinNorm());
        assertEquals(Verdict.MET, check.withinGamma());
        // peak |u| of the unit step is kr (the jump at t = 0+), below the 2.0 limit: no saturation
        assertFalse(report.saturation().saturates());
        assertEquals(
                2.0 / IndexingAxis.GAINS.referenceGain(), report.saturation().largestUnsaturatedStep(), 1e-9);
        SampledReport sampled = report.sampled();
        assertNotNull(sampled.longestPeriodSeconds());
        // the longest period meets the limits, 0.2% longer does not (bisection bracket width 1e-3)
        assertTrue(sampled.longestPeriodSeconds() > 0 && sampled.searchEvaluations() <= 6 + 12 + 20 + 1);
        assertEquals(Verdict.MET, report.delay().withinMargin());
        assertEquals(report.margins().delayMarginSeconds(), report.delay().delayMarginSeconds());
    }

    @Test
    void longerPeriodsMoveTheEmulatedStepFurtherFromTheContinuousOne() {
        RobustnessReport fine = verifier.verify(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                1,
                LIMITS,
                IndexingAxis.performanceOutput(),
                null,
                options(2e-4, false, null));
        RobustnessReport coarse = verifier.verify(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                1,
                LIMITS,
                IndexingAxis.performanceOutput(),
                null,
                options(4e-3, false, null));
        // for this loop the held first control value pushes harder early: faster rise, less overshoot
        double nominal = fine.nominal().overshootPercent();
        assertTrue(Math.abs(coarse.sampled().emulated().overshootPercent() - nominal)
                > Math.abs(fine.sampled().emulated().overshootPercent() - nominal));
        assertTrue(Math.abs(coarse.sampled().emulated().settlingTimeSeconds()
                        - fine.nominal().settlingTimeSeconds())
                > Math.abs(fine.sampled().emulated().settlingTimeSeconds()
                        - fine.nominal().settlingTimeSeconds()));
        assertEquals(Verdict.MET, fine.sampled().emulatedMeetsSpec());
    }

    @Test
    void aTooSlowSampledLoopIsReportedAsDivergingNotRejected() {
        // pi / max|pole| is about 0.1 s; at Ts = 0.5 s the emulated loop is unstable: spectral radius above 1
        RobustnessReport report = verifier.verify(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                1,
                LIMITS,
                IndexingAxis.performanceOutput(),
                null,
                options(0.5, false, null));
        assertTrue(
                report.sampled().spectralRadius() > 1,
                "radius " + report.sampled().spectralRadius());
        assertEquals(Verdict.NOT_MET, report.sampled().emulatedMeetsSpec());
        RobustnessReport fine = verifier.verify(
                IndexingAxis.PLANT,
                IndexingAxis.GAINS,
                1,
                LIMITS,
                IndexingAxis.performanceOutput(),
                null,
                options(1e-3, false, null));
        assertTrue(fine.sampled().spectralRadius() < 1);
    }

    @Test
    void capsAndUnstableLoopsAreRejected() {
        CapExceededException cap = assertThrows(
                CapExceededException.class,
                () -> verifier.verify(
                        IndexingAxis.PLANT,
                        IndexingAxis.GAINS,
                        1,
                        LIMITS,
                        IndexingAxis.performanceOutput(),
                        null,
                        options(1e-7, false, null)));
        assertEquals(CapExceededException.Option.SAMPLE_PERIOD, cap.option());
        assertTrue(cap.getMessage().contains(String.valueOf(DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS)));
        assertThrows(
                UnstableLoopException.class,
                () -> verifier.verify(
                        new CanonicalPlant(0, 0.48, 400, 400),
                        new FeedbackGains(-1, 0.1, 1),
                        1,
                        LIMITS,
                        IndexingAxis.performanceOutput(),
                        null,
                        options(null, false, null)));
    }

    // Regression (issue 12, item 8): the advised shortest sample period "use Ts >= X" is accepted when posted
    // back, for the sampling check and for the delay check (whose horizon includes the delay).
    // Reference: the cap rule itself, ceil(horizon / Ts) <= MAX_SAMPLE_INTERVALS, evaluated on the parsed advice.
    @Test
    void advisedShortestPeriodIsAcceptedWhenPostedBack() {
        java.util.regex.Pattern advice = java.util.regex.Pattern.compile("use Ts >= ([0-9.eE+-]+) s");
        for (Double delay : new Double[] {null, 0.01}) {
            CapExceededException cap = assertThrows(
                    CapExceededException.class,
                    () -> verifier.verify(
                            IndexingAxis.PLANT,
                            IndexingAxis.GAINS,
                            1,
                            LIMITS,
                            IndexingAxis.performanceOutput(),
                            null,
                            options(1e-7, false, delay)));
            java.util.regex.Matcher m = advice.matcher(cap.getMessage());
            assertTrue(m.find(), cap.getMessage());
            double advised = Double.parseDouble(m.group(1));
            RobustnessReport report = verifier.verify(
                    IndexingAxis.PLANT,
                    IndexingAxis.GAINS,
                    1,
                    LIMITS,
                    IndexingAxis.performanceOutput(),
                    null,
                    options(advised, false, delay));
            assertNotNull(report.sampled());
        }
        // brute force over horizons: the advice fits and is at most one printed unit above horizon / cap
        java.util.Random random = new java.util.Random(8);
        for (int i = 0; i < 1000; i++) {
            double horizon = Math.pow(10, -2 + 5 * random.nextDouble());
            double advised = RobustnessVerifier.shortestPeriod(horizon);
            assertTrue(Math.ceil(horizon / advised) <= DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS, "" + horizon);
            double exact = horizon / DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS;
            assertTrue(advised - exact <= 2 * Math.pow(10, Math.floor(Math.log10(exact)) - 5), "" + horizon);
        }
    }
}
