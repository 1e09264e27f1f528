package com.loopwright.solver.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.discrete.ContinuousControllerDesign;
import com.loopwright.solver.discrete.DiscreteController;
import com.loopwright.solver.discrete.DiscreteControllers;
import com.loopwright.solver.discrete.SampledControllerStep;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.robustness.SampledStepMetrics;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

/**
 * The sampled judges of a robust design against an independent simulation written here: the plant sampled by a
 * hand-written zero-order hold (the matrix exponential of [[A, B], [0, 0]] t by its Taylor series with scaling and
 * squaring, textbook), the controller recursion written out from its definition, and the step metrics read off a
 * grid ten times finer than the judge's.
 */
class SampledJudgesTest {

    private static final CanonicalPlant AXIS = new CanonicalPlant(0, 0.48, 400, 400);
    /** A corner of the README axis's inertia box (friction +20%, inertia -20%). */
    private static final CanonicalPlant CORNER = new CanonicalPlant(0, 0.384, 500, 500);

    @Test
    void theSampledLawJudgesMetricsAgreeWithAHandWrittenZeroOrderHoldRecursion() {
        double period = 0.008;
        // a lightly damped target so that rise, overshoot and settling all bind somewhere
        FeedbackGains gains = RobustTargetSearch.gains(AXIS, new TargetDynamics(0.6, 40));
        SampledLawJudge judge = new SampledLawJudge(AXIS, List.of(CORNER), period, 1, 0.02, t -> true);
        StepMetrics judged = judge.metrics(gains, CORNER);
        assertNotNull(judged);
        double horizon = SampledStepMetrics.horizonSeconds(CORNER, gains);
        Grid grid = handWritten(CORNER, gains, period, horizon, 200);
        // final value of the unclamped loop: b kr / (a0 + b k1) (textbook, the sampled loop keeps the DC gain)
        double finalValue = CORNER.b() * gains.referenceGain() / (CORNER.a0() + CORNER.b() * gains.positionGain());
        assertEquals(finalValue, judged.finalValue(), 1e-12);
        // the judge's grid is ten or more times coarser: interpolation errors of order (dt)^2 (common practice)
        assertEquals(grid.overshootPercent(finalValue), judged.overshootPercent(), 1e-3);
        assertEquals(grid.settlingTime(finalValue, 0.02), judged.settlingTimeSeconds(), 2e-4);
        assertEquals(grid.riseTime(finalValue), judged.riseTimeSeconds(), 2e-4);
        assertEquals(grid.peakControl(), judged.peakControl(), 1e-12);
        assertTrue(judged.overshootPercent() > 1, "the case is meant to overshoot: " + judged);
    }

    @Test
    void aSampledLawWhoseSpectralRadiusReachesOneFailsItsCase() {
        // wn T = 2.4: far beyond the emulation rule; the sampled loop of this corner is unstable
        FeedbackGains gains = RobustTargetSearch.gains(AXIS, new TargetDynamics(0.8, 300));
        double period = 0.008;
        assertTrue(SampledLawJudge.spectralRadius(CORNER, gains, period) >= 1);
        SampledLawJudge judge = new SampledLawJudge(AXIS, List.of(CORNER), period, 1, 0.02, t -> true);
        assertNull(judge.metrics(gains, CORNER));
        // and the export refuses the target itself: wn T above 0.5 (SampledLawDesigner's rule)
        assertNull(judge.designAt(new TargetDynamics(0.8, 300)));
    }

    @Test
    void aPeriodTooShortToSimulateIsAFailureOfThePeriodNotAFailedCase() {
        FeedbackGains gains = RobustTargetSearch.gains(AXIS, new TargetDynamics(0.8, 40));
        SampledLawJudge judge = new SampledLawJudge(AXIS, List.of(CORNER), 1e-7, 1, 0.02, t -> true);
        assertThrows(SamplePeriodException.class, () -> judge.metrics(gains, CORNER));
    }

    @Test
    void theDiscreteControllerStepAgreesWithAHandWrittenIntegralActionRecursion() {
        double period = 0.004;
        double k1 = 33.5;
        double k2 = 0.5356;
        double ki = 585.0;
        double kr = 4.96;
        double[][] a = {{0, 1}, {-CORNER.a0(), -CORNER.a1()}};
        double[] b2 = {0, CORNER.b()};
        double[][] measured = {{1, 0}, {0, 1}};
        DiscreteController controller = DiscreteControllers.fromContinuous(
                period,
                new ContinuousControllerDesign(
                        new double[][] {{0, 1}, {-AXIS.a0(), -AXIS.a1()}},
                        new double[] {0, AXIS.b()},
                        measured,
                        new double[] {k1, k2},
                        OptionalDouble.of(ki),
                        new double[2][0],
                        kr));
        double horizon = 0.6;
        DenseTrajectory judged = new SampledControllerStep().simulate(controller, a, b2, measured, 1, horizon);
        // by hand: u[k] = kr r + ki xi[k] - k1 x1[k] - k2 x2[k]; xi[k+1] = xi[k] + T (r - x1[k]) (the integrator's
        // input x1 held over the period, exact); x(t_k + o) = e^(A o) x[k] + Gamma(o) b u[k]
        int intervals = (int) Math.ceil(horizon / period);
        int substeps = (judged.length() - 1) / intervals;
        assertEquals(intervals * substeps + 1, judged.length());
        double[][][] holds = new double[substeps + 1][][];
        for (int j = 1; j <= substeps; j++) {
            holds[j] = hold(CORNER, period * j / substeps);
        }
        double x1 = 0;
        double x2 = 0;
        double xi = 0;
        int index = 0;
        double largest = 0;
        for (int k = 0; k < intervals; k++) {
            double u = kr + ki * xi - k1 * x1 - k2 * x2;
            double[] end = null;
            for (int j = 1; j <= substeps; j++) {
                end = apply(holds[j], x1, x2, u);
                index++;
                largest = Math.max(largest, Math.abs(end[0] - judged.x1()[index]));
                assertEquals(u, judged.control()[index], 1e-9 * Math.max(1, Math.abs(u)));
            }
            xi += period * (1 - x1);
            x1 = end[0];
            x2 = end[1];
        }
        assertTrue(largest < 1e-9, "largest |x1 difference| " + largest);
        // integral action: the sampled loop's rest is x1 = r exactly (final-value theorem, common practice)
        assertEquals(1, new SampledControllerStep().finalValue(controller, a, b2, measured, 1), 1e-9);
        assertEquals(1, x1, 1e-3);
    }

    @Test
    void theSampledRobustDesignOfTheReadmeAxisMeetsTheSpecOnEveryCaseByTheHandWrittenRecursion() {
        ParameterBox box = new ParameterBox(0, 0, 0.384, 0.576, 266.7, 500, 266.7, 500);
        double period = 0.008;
        RobustDesignReport robust = new RobustDesignPipeline()
                .design(
                        AXIS,
                        new DesignSpec(0.015, new TimeSpec.SettlingTime(0.15, 0.02)),
                        new GammaChoice.MarginOverMinimum(GammaChoice.MarginOverMinimum.DEFAULT_FACTOR),
                        1,
                        0.02,
                        box,
                        0,
                        7,
                        null,
                        period);
        var d = robust.report().design();
        FeedbackGains gains = new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain());
        assertEquals(period, robust.sampled().samplePeriodSeconds(), 0);
        for (CanonicalPlant corner : box.corners()) {
            Grid grid = handWritten(corner, gains, period, SampledStepMetrics.horizonSeconds(corner, gains), 40);
            double finalValue = corner.b() * gains.referenceGain() / (corner.a0() + corner.b() * gains.positionGain());
            // the limits as sent, with the finer grid's interpolation room (common practice)
            assertTrue(grid.settlingTime(finalValue, 0.02) <= 0.15 + 2e-4, corner.toString());
            assertTrue(grid.overshootPercent(finalValue) <= 1.5 + 1e-3, corner.toString());
        }
    }

    /** x1 and u at the sample instants and {@code perInterval} offsets within each interval, by hand. */
    private static Grid handWritten(
            CanonicalPlant plant, FeedbackGains gains, double period, double horizon, int perInterval) {
        int intervals = (int) Math.ceil(horizon / period);
        double[][][] holds = new double[perInterval + 1][][];
        for (int j = 1; j <= perInterval; j++) {
            holds[j] = hold(plant, period * j / perInterval);
        }
        int points = intervals * perInterval + 1;
        double[] t = new double[points];
        double[] y = new double[points];
        double[] u = new double[points];
        double x1 = 0;
        double x2 = 0;
        int index = 0;
        for (int k = 0; k < intervals; k++) {
            double command = gains.referenceGain() - gains.positionGain() * x1 - gains.velocityGain() * x2;
            if (k == 0) {
                u[0] = command;
            }
            double[] end = null;
            for (int j = 1; j <= perInterval; j++) {
                end = apply(holds[j], x1, x2, command);
                index++;
                t[index] = k * period + period * j / perInterval;
                y[index] = end[0];
                u[index] = command;
            }
            x1 = end[0];
            x2 = end[1];
        }
        return new Grid(t, y, u);
    }

    /** {e^(A o), Gamma(o) b} of the canonical plant, from the exponential of [[A, b], [0, 0]] o (3 x 3). */
    private static double[][] hold(CanonicalPlant plant, double offset) {
        double[][] m = {{0, 1, 0}, {-plant.a0(), -plant.a1(), plant.b()}, {0, 0, 0}};
        double[][] e = exp(m, offset);
        return new double[][] {{e[0][0], e[0][1], e[0][2]}, {e[1][0], e[1][1], e[1][2]}};
    }

    private static double[] apply(double[][] hold, double x1, double x2, double u) {
        return new double[] {
            hold[0][0] * x1 + hold[0][1] * x2 + hold[0][2] * u, hold[1][0] * x1 + hold[1][1] * x2 + hold[1][2] * u
        };
    }

    /** e^(M t): scale by 2^s until |M t| &lt; 0.5, 20 Taylor terms, square s times (textbook). */
    private static double[][] exp(double[][] m, double t) {
        int n = m.length;
        double norm = 0;
        for (double[] row : m) {
            double sum = 0;
            for (double v : row) {
                sum += Math.abs(v * t);
            }
            norm = Math.max(norm, sum);
        }
        int squarings = Math.max(0, (int) Math.ceil(Math.log(norm / 0.5) / Math.log(2)));
        double scale = t / Math.pow(2, squarings);
        double[][] result = identity(n);
        double[][] term = identity(n);
        for (int k = 1; k <= 20; k++) {
            term = multiply(term, m);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    term[i][j] *= scale / k;
                    result[i][j] += term[i][j];
                }
            }
        }
        for (int s = 0; s < squarings; s++) {
            result = multiply(result, result);
        }
        return result;
    }

    private static double[][] identity(int n) {
        double[][] id = new double[n][n];
        for (int i = 0; i < n; i++) {
            id[i][i] = 1;
        }
        return id;
    }

    private static double[][] multiply(double[][] a, double[][] b) {
        int n = a.length;
        double[][] c = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < n; k++) {
                for (int j = 0; j < n; j++) {
                    c[i][j] += a[i][k] * b[k][j];
                }
            }
        }
        return c;
    }

    /** Step metrics read off a dense grid by their definitions (10-90% rise, 2% band, overshoot over y_inf). */
    private record Grid(double[] t, double[] y, double[] u) {

        double overshootPercent(double finalValue) {
            double peak = 0;
            for (double v : y) {
                peak = Math.max(peak, v / finalValue);
            }
            return Math.max(0, 100 * (peak - 1));
        }

        double peakControl() {
            double peak = 0;
            for (double v : u) {
                peak = Math.max(peak, Math.abs(v));
            }
            return peak;
        }

        double settlingTime(double finalValue, double band) {
            for (int i = y.length - 2; i >= 0; i--) {
                double e0 = Math.abs(y[i] / finalValue - 1) - band;
                if (e0 > 0) {
                    double e1 = Math.abs(y[i + 1] / finalValue - 1) - band;
                    return t[i] + (t[i + 1] - t[i]) * e0 / (e0 - e1);
                }
            }
            return 0;
        }

        double riseTime(double finalValue) {
            return reaching(finalValue, 0.9) - reaching(finalValue, 0.1);
        }

        private double reaching(double finalValue, double level) {
            for (int i = 1; i < y.length; i++) {
                double z1 = y[i] / finalValue;
                if (z1 >= level) {
                    double z0 = y[i - 1] / finalValue;
                    return t[i - 1] + (t[i] - t[i - 1]) * (level - z0) / (z1 - z0);
                }
            }
            return Double.NaN;
        }
    }
}
