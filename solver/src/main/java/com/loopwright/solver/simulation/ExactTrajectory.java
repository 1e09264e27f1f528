package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/**
 * The exact continuous solution of x' = A x + bRef r between the samples of a
 * {@link StepResponse}: x(t_k + tau) = Ad(tau) x_k + Bd(tau) r with Ad(tau), Bd(tau) the
 * zero-order hold of (A, bRef) over tau (exact because r is constant).
 */
final class ExactTrajectory {

    private final DMatrixRMaj a;
    private final DMatrixRMaj bRef;
    private final double reference;
    private final double[] timeSeconds;
    private final double[][] state;

    ExactTrajectory(LinearLoop loop, double reference, StepResponse response) {
        this(loop, reference, response.timeSeconds(), response.state());
    }

    /** Takes the arrays over without copying: the caller must not modify them afterwards. */
    ExactTrajectory(LinearLoop loop, double reference, double[] timeSeconds, double[][] state) {
        this.a = loop.a();
        this.bRef = loop.bRef();
        this.reference = reference;
        this.timeSeconds = timeSeconds;
        this.state = state;
    }

    int sampleCount() {
        return timeSeconds.length;
    }

    double time(int sampleIndex) {
        return timeSeconds[sampleIndex];
    }

    /** Sample state x_k (not copied: callers must not modify it). */
    double[] sampleState(int sampleIndex) {
        return state[sampleIndex];
    }

    /** x(t) for t in [t_k, t_(k+1)], propagated exactly from sample k. */
    double[] stateBetween(int sampleIndex, double tSeconds) {
        double tau = tSeconds - timeSeconds[sampleIndex];
        double[] start = state[sampleIndex];
        if (tau <= 0.0) {
            return start.clone();
        }
        DiscreteStateSpace hold = ZeroOrderHold.discretize(a, bRef, tau);
        DMatrixRMaj ad = hold.ad();
        DMatrixRMaj bd = hold.bd();
        int n = start.length;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double sum = bd.unsafe_get(i, 0) * reference;
            for (int j = 0; j < n; j++) {
                sum += ad.unsafe_get(i, j) * start[j];
            }
            x[i] = sum;
        }
        return x;
    }

    /** x' = A x + bRef r. */
    double[] rate(double[] x) {
        int n = x.length;
        double[] rate = new double[n];
        for (int i = 0; i < n; i++) {
            double sum = bRef.unsafe_get(i, 0) * reference;
            for (int j = 0; j < n; j++) {
                sum += a.unsafe_get(i, j) * x[j];
            }
            rate[i] = sum;
        }
        return rate;
    }
}
