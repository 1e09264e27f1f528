package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

class SubIntervalPropagatorTest {

    @Test
    void closedFormMatchesTheZeroOrderHoldRouteOnRandomLoops() {
        // source: the general route, x(t_k + tau) = Ad(tau) x_k + Bd(tau) r from the Van Loan
        // block exponential (ZeroOrderHold), on 300 random stable 2-state loops and states;
        // agreement to 1e-13 of max(|x_k|, |x(t_k + tau)|, |bRef r| tau).
        Random random = new Random(81L);
        double[] target = new double[2];
        double[] reference = new double[2];
        for (int c = 0; c < 300; c++) {
            LinearLoop loop = SecondOrderLoops.randomStableLoop(1000L + c, 2, 0.05 + random.nextDouble());
            double r = random.nextGaussian();
            TwoStatePropagator closed = new TwoStatePropagator(loop, r);
            HoldPropagator hold = new HoldPropagator(loop, r);
            double[] state = {random.nextGaussian(), random.nextGaussian(), random.nextGaussian(), random.nextGaussian()
            };
            double tau = Math.pow(10, -4 + 4 * random.nextDouble());
            closed.propagate(state, 2, tau, target);
            hold.propagate(state, 2, tau, reference);
            double scale = Math.max(
                    Math.max(Math.abs(state[2]), Math.abs(state[3])),
                    Math.max(Math.abs(reference[0]), Math.abs(reference[1])));
            scale = Math.max(
                    scale,
                    Math.abs(r)
                            * tau
                            * Math.max(
                                    Math.abs(loop.bRef().get(0, 0)),
                                    Math.abs(loop.bRef().get(1, 0))));
            for (int i = 0; i < 2; i++) {
                assertEquals(reference[i], target[i], 1e-13 * scale, "loop " + c + ", state " + i);
            }
        }
    }

    @Test
    void closedFormFollowsTheTextbookStepBetweenSamples() {
        // source: step response of wn^2 / (s^2 + 2 zeta wn s + wn^2), any control textbook:
        // underdamped y = 1 - e^(-zeta wn t) / sqrt(1 - zeta^2) sin(wd t + acos zeta),
        // y' = wn / sqrt(1 - zeta^2) e^(-zeta wn t) sin(wd t); critically damped
        // y = 1 - e^(-wn t) (1 + wn t), y' = wn^2 t e^(-wn t) (the repeated-eigenvalue case).
        double wn = 25.0;
        double[] target = new double[2];
        for (double zeta : new double[] {0.3, 0.8, 1.0}) {
            LinearLoop loop = SecondOrderLoops.stateFeedbackLoop(zeta, wn);
            TwoStatePropagator closed = new TwoStatePropagator(loop, 1.0);
            for (double tk : new double[] {0.0, 0.013, 0.1, 0.31}) {
                double[] sample = {position(zeta, wn, tk), velocity(zeta, wn, tk)};
                for (double tau : new double[] {1e-9, 1e-5, 2.3e-4, 0.004}) {
                    closed.propagate(sample, 0, tau, target);
                    assertEquals(position(zeta, wn, tk + tau), target[0], 1e-14, "zeta " + zeta);
                    assertEquals(velocity(zeta, wn, tk + tau), target[1], 1e-14 * wn, "zeta " + zeta);
                }
            }
        }
    }

    private static double position(double zeta, double wn, double t) {
        if (zeta == 1.0) {
            return 1 - Math.exp(-wn * t) * (1 + wn * t);
        }
        double root = Math.sqrt(1 - zeta * zeta);
        return 1 - Math.exp(-zeta * wn * t) / root * Math.sin(wn * root * t + Math.acos(zeta));
    }

    private static double velocity(double zeta, double wn, double t) {
        if (zeta == 1.0) {
            return wn * wn * t * Math.exp(-wn * t);
        }
        double root = Math.sqrt(1 - zeta * zeta);
        return wn / root * Math.exp(-zeta * wn * t) * Math.sin(wn * root * t);
    }

    @Test
    void closedFormAllocatesNothingPerCall() {
        // source: common practice; HotSpot's per-thread allocation counter
        // (com.sun.management.ThreadMXBean.getThreadAllocatedBytes) before and after 100000 calls.
        if (!(ManagementFactory.getThreadMXBean() instanceof com.sun.management.ThreadMXBean threads)
                || !threads.isThreadAllocatedMemorySupported()) {
            return;
        }
        LinearLoop loop = SecondOrderLoops.stateFeedbackLoop(0.8, 25.0);
        TwoStatePropagator closed = new TwoStatePropagator(loop, 1.0);
        double[] state = {0.3, 2.0};
        double[] target = new double[2];
        long thread = Thread.currentThread().getId();
        for (int i = 0; i < 20_000; i++) {
            closed.propagate(state, 0, 1e-4 * (1 + i % 7), target);
        }
        long before = threads.getThreadAllocatedBytes(thread);
        double sink = 0;
        for (int i = 0; i < 100_000; i++) {
            closed.propagate(state, 0, 1e-4 * (1 + i % 7), target);
            sink += target[0];
        }
        long allocated = threads.getThreadAllocatedBytes(thread) - before;
        assertTrue(Double.isFinite(sink));
        // A few hundred bytes at most (the counter call itself); one double[2] per call would be
        // 3.2 MB.
        assertTrue(allocated < 10_000, allocated + " bytes for 100000 calls");
    }

    @Test
    void choosesTheClosedFormForTwoStatesOnly() {
        assertTrue(
                SubIntervalPropagator.of(SecondOrderLoops.stateFeedbackLoop(0.5, 2.0), 1.0)
                        instanceof TwoStatePropagator);
        assertTrue(
                SubIntervalPropagator.of(SecondOrderLoops.randomStableLoop(4L, 4, 0.5), 1.0) instanceof HoldPropagator);
        assertTrue(
                SubIntervalPropagator.of(SecondOrderLoops.randomStableLoop(3L, 3, 0.5), 1.0) instanceof HoldPropagator);
        LinearLoop singular = new LinearLoop(
                new DMatrixRMaj(new double[][] {{0, 1}, {0, 0}}),
                new DMatrixRMaj(new double[][] {{0}, {1}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{0, 0}}),
                1.0);
        assertThrows(IllegalArgumentException.class, () -> new TwoStatePropagator(singular, 1.0));
        assertThrows(
                IllegalArgumentException.class,
                () -> new TwoStatePropagator(SecondOrderLoops.randomStableLoop(3L, 3, 0.5), 1.0));
    }
}
