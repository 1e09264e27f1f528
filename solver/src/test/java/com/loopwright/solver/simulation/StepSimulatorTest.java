package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.ejml.data.DMatrixRMaj;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

class StepSimulatorTest {

    private final StepSimulator simulator = new StepSimulator();

    @Test
    void underdampedSamplesMatchAnalyticResponse() {
        // source: step response of wn^2 / (s^2 + 2 zeta wn s + wn^2), any control textbook:
        // y(t) = 1 - e^(-zeta wn t) / sqrt(1 - zeta^2) sin(wd t + acos zeta), wd = wn sqrt(1-zeta^2),
        // and its derivative y'(t) = wn / sqrt(1 - zeta^2) e^(-zeta wn t) sin(wd t).
        double zeta = 0.4;
        double wn = 3.0;
        double r = 2.0;
        double horizonSeconds = 10.0;
        int samples = 1001;
        StepResponse response =
                simulator.simulate(SecondOrderLoops.stateFeedbackLoop(zeta, wn), r, horizonSeconds, samples);
        double root = Math.sqrt(1 - zeta * zeta);
        double wd = wn * root;
        double[] time = response.timeSeconds();
        double[] output = response.output();
        double[] control = response.control();
        assertEquals(samples, response.sampleCount());
        assertEquals(2, response.stateDimension());
        assertEquals(0.0, time[0]);
        assertEquals(horizonSeconds, time[samples - 1]);
        for (int k = 0; k < samples; k++) {
            double t = time[k];
            assertEquals(horizonSeconds * k / (samples - 1), t, 1e-15 * horizonSeconds);
            double envelope = Math.exp(-zeta * wn * t);
            double y = r * (1 - envelope / root * Math.sin(wd * t + Math.acos(zeta)));
            double yDot = r * wn / root * envelope * Math.sin(wd * t);
            // u = y'' for the double-integrator plant: u = wn^2 (r - y) - 2 zeta wn y'.
            double u = wn * wn * (r - y) - 2 * zeta * wn * yDot;
            assertEquals(y, response.state(k, 0), 1e-13 * r, "y at t = " + t);
            assertEquals(y, output[k], 1e-13 * r, "output at t = " + t);
            assertEquals(yDot, response.state(k, 1), 1e-13 * r * wn, "y' at t = " + t);
            assertEquals(u, control[k], 1e-12 * r * wn * wn, "u at t = " + t);
        }
        // The step reaches u at t = 0+: u(0+) = dControl r = wn^2 r.
        assertEquals(wn * wn * r, control[0]);
    }

    @Test
    void secondOrderLoopAgreesWithDormandPrince() {
        assertAgreesWithDormandPrince(SecondOrderLoops.stateFeedbackLoop(0.35, 12.0), 1.7, 2.0, 500);
    }

    @Test
    void randomFourthOrderLoopAgreesWithDormandPrince() {
        assertAgreesWithDormandPrince(SecondOrderLoops.randomStableLoop(4L, 4, 0.5), -0.8, 12.0, 500);
    }

    /**
     * source: Hipparchus DormandPrince853Integrator (an adaptive 8th-order Runge-Kutta) with
     * absolute and relative tolerances 1e-12, integrating x' = A x + bRef r from sample to sample;
     * agreement to 1e-9 times max(|r|, largest |value| of that signal).
     */
    private void assertAgreesWithDormandPrince(LinearLoop loop, double r, double horizonSeconds, int samples) {
        StepResponse response = simulator.simulate(loop, r, horizonSeconds, samples);
        int n = loop.stateDimension();
        OrdinaryDifferentialEquation ode = SecondOrderLoops.referenceOde(loop, r);
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-12, horizonSeconds, 1e-12, 1e-12);
        double[] time = response.timeSeconds();
        double[] state = response.stateRowMajor();
        double[] output = response.output();
        double[] control = response.control();
        double[][] reference = new double[samples][];
        reference[0] = new double[n];
        ODEState current = new ODEState(0.0, reference[0]);
        for (int k = 1; k < samples; k++) {
            ODEStateAndDerivative next = integrator.integrate(ode, current, time[k]);
            reference[k] = next.getPrimaryState();
            current = new ODEState(next.getTime(), next.getPrimaryState());
        }
        double[] stateScale = new double[n];
        double outputScale = Math.abs(r);
        double controlScale = Math.abs(r);
        double[] referenceOutput = new double[samples];
        double[] referenceControl = new double[samples];
        for (int k = 0; k < samples; k++) {
            referenceOutput[k] = 0.0;
            referenceControl[k] = loop.dControl() * r;
            for (int j = 0; j < n; j++) {
                referenceOutput[k] += loop.cOut().get(0, j) * reference[k][j];
                referenceControl[k] += loop.cControl().get(0, j) * reference[k][j];
                stateScale[j] = Math.max(Math.max(stateScale[j], Math.abs(r)), Math.abs(reference[k][j]));
            }
            outputScale = Math.max(outputScale, Math.abs(referenceOutput[k]));
            controlScale = Math.max(controlScale, Math.abs(referenceControl[k]));
        }
        for (int k = 0; k < samples; k++) {
            for (int j = 0; j < n; j++) {
                assertEquals(
                        reference[k][j], state[k * n + j], 1e-9 * stateScale[j], "state " + j + " at t = " + time[k]);
            }
            assertEquals(referenceOutput[k], output[k], 1e-9 * outputScale, "y at t = " + time[k]);
            assertEquals(referenceControl[k], control[k], 1e-9 * controlScale, "u at t = " + time[k]);
        }
    }

    @Test
    void zeroStepGivesZeroResponse() {
        // source: linearity with x(0) = 0: r = 0 gives x(t) = 0.
        StepResponse response = simulator.simulate(SecondOrderLoops.stateFeedbackLoop(0.5, 2.0), 0.0, 3.0, 10);
        for (double y : response.output()) {
            assertEquals(0.0, y);
        }
    }

    @Test
    void recordsCopyTheirArrays() {
        StepResponse response = simulator.simulate(SecondOrderLoops.stateFeedbackLoop(0.5, 2.0), 1.0, 3.0, 10);
        double before = response.output()[5];
        double beforeVelocity = response.state(5, 1);
        response.output()[5] = 99;
        response.stateRowMajor()[10] = 99;
        response.stateAt(5)[1] = 99;
        response.timeSeconds()[5] = 99;
        response.control()[5] = 99;
        assertEquals(before, response.output()[5]);
        assertEquals(before, response.outputAt(5));
        assertEquals(before, response.state(5, 0));
        assertEquals(before, response.stateRowMajor()[10]);
        assertEquals(before, response.stateAt(5)[0]);
        assertEquals(beforeVelocity, response.stateAt(5)[1]);
        assertEquals(beforeVelocity, response.stateRowMajor()[11]);
        assertTrue(response.timeSeconds()[5] < 3.0);
        assertEquals(response.timeSeconds()[5], response.timeAt(5));
        assertEquals(response.control()[5], response.controlAt(5));

        // The public constructor copies: later writes to the caller's arrays do not show.
        double[] time = {0, 1, 2};
        double[] state = {0, 10, 1, 11, 2, 12};
        double[] values = {0, 1, 2};
        StepResponse built = new StepResponse(time, state, 2, values, values);
        state[2] = 7;
        time[1] = 7;
        values[1] = 7;
        assertEquals(3, built.sampleCount());
        assertEquals(2, built.stateDimension());
        assertEquals(1.0, built.stateAt(1)[0]);
        assertEquals(11.0, built.state(1, 1));
        assertEquals(1.0, built.timeSeconds()[1]);
        assertEquals(1.0, built.outputAt(1));
        assertEquals(1.0, built.control()[1]);
        assertEquals(
                built,
                new StepResponse(
                        new double[] {0, 1, 2},
                        new double[] {0, 10, 1, 11, 2, 12},
                        2,
                        new double[] {0, 1, 2},
                        new double[] {0, 1, 2}));
        assertEquals(
                built.hashCode(),
                new StepResponse(
                                new double[] {0, 1, 2},
                                new double[] {0, 10, 1, 11, 2, 12},
                                2,
                                new double[] {0, 1, 2},
                                new double[] {0, 1, 2})
                        .hashCode());
        assertTrue(!built.equals(new StepResponse(
                new double[] {0, 1, 2}, new double[] {0, 10, 1, 11, 2, 13}, 2, new double[] {0, 1, 2}, new double[] {
                    0, 1, 2
                })));
        assertThrows(IllegalArgumentException.class, () -> built.stateAt(3));
        assertThrows(IllegalArgumentException.class, () -> built.stateAt(-1));
        assertThrows(IllegalArgumentException.class, () -> built.state(0, 2));
        assertThrows(IllegalArgumentException.class, () -> built.state(3, 0));
        assertThrows(IllegalArgumentException.class, () -> built.outputAt(3));

        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{-1}});
        LinearLoop loop = new LinearLoop(
                a,
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                0.0);
        a.set(0, 0, 5);
        loop.a().set(0, 0, 5);
        assertEquals(-1.0, loop.a().get(0, 0));
    }

    @Test
    void rejectsBadArguments() {
        LinearLoop loop = SecondOrderLoops.stateFeedbackLoop(0.5, 2.0);
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(null, 1, 1, 10));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, 1, 1, 1));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, 1, 1, 100_001));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, 1, 0, 10));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, 1, -1, 10));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, 1, Double.NaN, 10));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, 1, Double.POSITIVE_INFINITY, 10));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, Double.NaN, 1, 10));
        // A diverging loop overflows: reported, never returned as Infinity.
        LinearLoop unstable = new LinearLoop(
                new DMatrixRMaj(new double[][] {{50}}),
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                0.0);
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(unstable, 1, 100, 100_000));
        assertThrows(IllegalArgumentException.class, () -> simulator.simulate(unstable, 1, 100, 2));

        DMatrixRMaj a = loop.a();
        DMatrixRMaj b = loop.bRef();
        DMatrixRMaj c = loop.cOut();
        assertThrows(IllegalArgumentException.class, () -> new LinearLoop(null, b, c, c, 0));
        assertThrows(IllegalArgumentException.class, () -> new LinearLoop(a, c, c, c, 0));
        assertThrows(IllegalArgumentException.class, () -> new LinearLoop(a, b, b, c, 0));
        assertThrows(IllegalArgumentException.class, () -> new LinearLoop(a, b, c, b, 0));
        assertThrows(IllegalArgumentException.class, () -> new LinearLoop(a, b, c, c, Double.NaN));
        assertThrows(
                IllegalArgumentException.class,
                () -> new LinearLoop(new DMatrixRMaj(new double[][] {{0, Double.NaN}, {0, 0}}), b, c, c, 0));
        assertThrows(
                IllegalArgumentException.class,
                () -> new LinearLoop(
                        new DMatrixRMaj(32, 32),
                        new DMatrixRMaj(32, 1),
                        new DMatrixRMaj(1, 32),
                        new DMatrixRMaj(1, 32),
                        0));
    }

    @Test
    void overflowIsReportedAtTheFirstBadSample() {
        // source: x' = 50 x + 1 from x(0) = 0 has x(t) = (e^(50 t) - 1) / 50 (linear ODE, from memory),
        // beyond double range once 50 t > ln 50 + ln Double.MAX_VALUE.
        LinearLoop unstable = new LinearLoop(
                new DMatrixRMaj(new double[][] {{50}}),
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                0.0);
        int samples = 100_000;
        double threshold = (Math.log(50) + Math.log(Double.MAX_VALUE)) / 50;
        int first = (int) Math.ceil(threshold / (100.0 / (samples - 1)));
        IllegalArgumentException state =
                assertThrows(IllegalArgumentException.class, () -> simulator.simulate(unstable, 1, 100, samples));
        assertEquals(
                "response overflows double precision at t = " + 100 * ((double) first / (samples - 1))
                        + " s: the loop diverges over this horizon",
                state.getMessage());
        // x' = -x + 10: x(t) = 10 (1 - e^-t) stays finite, y = 1e308 x leaves double range first at
        // t = 0.2 on a 0.1 s grid (x(0.1) = 0.95, x(0.2) = 1.81 > 1.797).
        LinearLoop hugeOutput = new LinearLoop(
                new DMatrixRMaj(new double[][] {{-1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1e308}}),
                new DMatrixRMaj(new double[][] {{1}}),
                0.0);
        IllegalArgumentException output =
                assertThrows(IllegalArgumentException.class, () -> simulator.simulate(hugeOutput, 10, 1, 11));
        assertEquals(
                "output or control overflows double precision at t = " + 1 * (2.0 / 10) + " s", output.getMessage());
        // A large but finite response is returned even though the sum of all y + u overflows.
        LinearLoop large = new LinearLoop(
                new DMatrixRMaj(new double[][] {{-1}}),
                new DMatrixRMaj(new double[][] {{1}}),
                new DMatrixRMaj(new double[][] {{1e307}}),
                new DMatrixRMaj(new double[][] {{1e307}}),
                0.0);
        StepResponse finite = simulator.simulate(large, 10, 20, 1000);
        assertTrue(Double.isFinite(finite.outputAt(999)) && finite.outputAt(999) > 9e307);
    }

    @Test
    void streamedMetricSamplesAreTheSimulatorsSamplesBitForBit() {
        // source: simulate() and the general pass over its states (the previous implementation's
        // SampledSignal.fill, kept in ArrayStepMetricsOracle; the summation order the metrics always
        // used): the streaming recursion, for n = 2 with the state in locals, must hand the sink
        // exactly the same numbers, and throw the same errors.
        LinearLoop[] loops = {
            SecondOrderLoops.stateFeedbackLoop(0.3, 12.0),
            SecondOrderLoops.randomStableLoop(7L, 2, 0.3),
            SecondOrderLoops.randomStableLoop(4L, 4, 0.5)
        };
        for (LinearLoop loop : loops) {
            int n = loop.stateDimension();
            double r = 1.3;
            double[] weights = new double[n];
            for (int j = 0; j < n; j++) {
                weights[j] = 0.7 * (j + 1) - 0.4;
            }
            int samples = 700;
            StepResponse response = simulator.simulate(loop, r, 5.0, samples);
            double[] state = new double[samples * n];
            double[][] streamed = new double[4][samples];
            int[] next = {0};
            StepSimulator.stream(loop, r, 5.0, samples, weights, (k, x, z, zRate, u, uRate) -> {
                assertEquals(next[0]++, k);
                System.arraycopy(x, 0, state, k * n, n);
                streamed[0][k] = z;
                streamed[1][k] = zRate;
                streamed[2][k] = u;
                streamed[3][k] = uRate;
            });
            assertEquals(samples, next[0]);
            assertArrayEquals(response.stateRowMajor(), state);
            assertArrayEquals(response.control(), streamed[2]);
            ArrayStepMetricsOracle.SampledSignal output = new ArrayStepMetricsOracle.SampledSignal(weights, 0.0);
            output.fill(response.stateRowMajor(), n, loop.a().data, loop.bRef().data, r);
            ArrayStepMetricsOracle.SampledSignal control =
                    new ArrayStepMetricsOracle.SampledSignal(loop.cControl().data, loop.dControl() * r);
            control.fill(response.stateRowMajor(), n, loop.a().data, loop.bRef().data, r);
            assertArrayEquals(output.valueArray(), streamed[0]);
            assertArrayEquals(output.rateArray(), streamed[1]);
            assertArrayEquals(control.valueArray(), streamed[2]);
            assertArrayEquals(control.rateArray(), streamed[3]);
        }
        StepSampleSink ignore = (k, x, z, zRate, u, uRate) -> {};
        LinearLoop unstable = new LinearLoop(
                new DMatrixRMaj(new double[][] {{50, 0}, {0, -1}}),
                new DMatrixRMaj(new double[][] {{1}, {1}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{1, 1}}),
                0.0);
        IllegalArgumentException expected =
                assertThrows(IllegalArgumentException.class, () -> simulator.simulate(unstable, 1, 100, 100_000));
        IllegalArgumentException actual = assertThrows(
                IllegalArgumentException.class,
                () -> StepSimulator.stream(unstable, 1, 100, 100_000, new double[] {1, 0}, ignore));
        assertEquals(expected.getMessage(), actual.getMessage());
        LinearLoop hugeOutput = new LinearLoop(
                new DMatrixRMaj(new double[][] {{-1, 0}, {0, -2}}),
                new DMatrixRMaj(new double[][] {{1}, {1}}),
                new DMatrixRMaj(new double[][] {{1e308, 0}}),
                new DMatrixRMaj(new double[][] {{1, 1}}),
                0.0);
        expected = assertThrows(IllegalArgumentException.class, () -> simulator.simulate(hugeOutput, 10, 1, 11));
        actual = assertThrows(
                IllegalArgumentException.class,
                () -> StepSimulator.stream(hugeOutput, 10, 1, 11, new double[] {1, 0}, ignore));
        assertEquals(expected.getMessage(), actual.getMessage());
        assertTrue(expected.getMessage().startsWith("output or control overflows"));
        // A subnormal horizon (about 700 units of the smallest double over 999 intervals) repeats
        // sample times: the same refusal.
        LinearLoop loop = SecondOrderLoops.stateFeedbackLoop(0.5, 2.0);
        expected = assertThrows(IllegalArgumentException.class, () -> simulator.simulate(loop, 1, 3.5e-321, 1000));
        actual = assertThrows(
                IllegalArgumentException.class,
                () -> StepSimulator.stream(loop, 1, 3.5e-321, 1000, new double[] {1, 0}, ignore));
        assertEquals(expected.getMessage(), actual.getMessage());
    }

    @Test
    void stepResponseValidatesItsSamples() {
        double[] two = {0, 1};
        IllegalArgumentException nan = assertThrows(
                IllegalArgumentException.class,
                () -> new StepResponse(two, new double[] {0, 0, 0, Double.NaN}, 2, two, two));
        assertEquals("state[1][1] is not finite: NaN", nan.getMessage());
        IllegalArgumentException flat = assertThrows(
                IllegalArgumentException.class,
                () -> new StepResponse(new double[] {0, 0}, new double[] {0, 0}, 1, two, two));
        assertEquals("timeSeconds must be strictly increasing at 1", flat.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new StepResponse(two, new double[] {0, 0, 0}, 2, two, two));
        assertThrows(IllegalArgumentException.class, () -> new StepResponse(two, two, 0, two, two));
        assertThrows(
                IllegalArgumentException.class,
                () -> new StepResponse(new double[] {0}, new double[] {0}, 1, new double[] {0}, new double[] {0}));
        assertThrows(IllegalArgumentException.class, () -> new StepResponse(two, two, 1, new double[] {0, 1, 2}, two));
        assertThrows(IllegalArgumentException.class, () -> new StepResponse(null, two, 1, two, two));
        assertThrows(IllegalArgumentException.class, () -> new StepResponse(two, null, 1, two, two));
        assertThrows(
                IllegalArgumentException.class,
                () -> new StepResponse(two, two, 1, new double[] {0, Double.POSITIVE_INFINITY}, two));
        assertThrows(
                IllegalArgumentException.class, () -> new StepResponse(two, two, 1, two, new double[] {Double.NaN, 0}));
        assertThrows(
                IllegalArgumentException.class,
                () -> new StepResponse(new double[] {0, Double.POSITIVE_INFINITY}, two, 1, two, two));
    }
}
