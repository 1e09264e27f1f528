package com.loopwright.solver.robustness;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The simulated window reaches the step's overshoot peak. Reference throughout: the exact second-order step
 * response of b kr / (s^2 + c1 s + c0) (no zero), whose overshoot is e^(-sigma pi / wd) of the final value with
 * sigma = c1 / 2 and wd = sqrt(c0 - sigma^2) (any control textbook, e.g. Ogata, transient-response chapter).
 */
class LatePeakHorizonTest {

    /** Regression (issue 12, item 9): the peak at pi / wd = 0.718 s came after the 0.633 s window. */
    private static final CanonicalPlant PLANT =
            new CanonicalPlant(158.26763769334335, 10.807564793416091, -8.24527590299888, 0.4354674102081221);

    private static final FeedbackGains GAINS =
            new FeedbackGains(-26.698820246411938, -3.286906667311671, -45.8937676993868);

    private static double textbookOvershootPercent(CanonicalPlant plant, FeedbackGains gains) {
        double sigma = 0.5 * (plant.a1() + plant.b() * gains.velocityGain());
        double c0 = plant.a0() + plant.b() * gains.positionGain();
        double wd = Math.sqrt(c0 - sigma * sigma);
        return 100 * Math.exp(-sigma * Math.PI / wd);
    }

    @Test
    void overshootPeakAfterTheBaseWindowIsMeasured() {
        double expected = textbookOvershootPercent(PLANT, GAINS);
        assertEquals(1.22e-4, expected, 0.01e-4); // the value
        double sigma = 0.5 * (PLANT.a1() + PLANT.b() * GAINS.velocityGain());
        assertTrue(LoopMatrices.HORIZON_PER_TIME_CONSTANT / sigma < 0.64, "the base window ends before the peak");
        RobustnessReport report = new RobustnessVerifier()
                .verify(
                        PLANT,
                        GAINS,
                        1,
                        new AcceptanceLimits(null, null, 1.0, 0.02),
                        new org.ejml.data.DMatrixRMaj(new double[][] {{1, 0}}),
                        null,
                        new RobustnessOptions(null, 0, 1, List.of(), null, null, false, null, 0, 0));
        assertEquals(expected, report.nominal().overshootPercent(), 1e-4 * expected);
        assertTrue(report.horizonSeconds() > 0.718);
        UncertainCase corner = new UncertaintyAnalyzer()
                .evaluate(
                        PLANT,
                        true,
                        GAINS,
                        1,
                        new AcceptanceLimits(null, null, 1.0, 0.02),
                        new org.ejml.data.DMatrixRMaj(new double[][] {{1, 0}}));
        assertEquals(expected, corner.overshootPercent(), 1e-4 * expected);
    }

    // Brute force over random stable underdamped loops, many with late peaks: the measured overshoot matches the
    // formula to 1e-9 points absolute (or 1e-6 relative), so no peak is lost after the window.
    @Test
    void randomLightlyOscillatingLoopsMatchTheTextbookOvershoot() {
        Random random = new Random(9);
        UncertaintyAnalyzer analyzer = new UncertaintyAnalyzer();
        for (int i = 0; i < 200; i++) {
            double sigma = Math.pow(10, -1 + 2 * random.nextDouble());
            double wd = sigma * Math.pow(10, -1.5 + 1.5 * random.nextDouble()); // wd up to sigma: peaks late
            double c0 = sigma * sigma + wd * wd;
            CanonicalPlant plant = new CanonicalPlant(0, 0, 1, 1);
            FeedbackGains gains = new FeedbackGains(c0, 2 * sigma, c0);
            double expected = textbookOvershootPercent(plant, gains);
            UncertainCase measured = analyzer.evaluate(
                    plant,
                    false,
                    gains,
                    1,
                    new AcceptanceLimits(null, null, 1.0, 0.02),
                    new org.ejml.data.DMatrixRMaj(new double[][] {{1, 0}}));
            assertEquals(
                    expected,
                    measured.overshootPercent(),
                    Math.max(1e-9, 1e-6 * expected),
                    "sigma " + sigma + ", wd " + wd);
        }
    }
}
