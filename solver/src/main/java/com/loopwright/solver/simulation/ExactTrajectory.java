package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/**
 * The exact continuous solution of x' = A x + bRef r between the samples of a step response:
 * x(t_k + tau) by a {@link SubIntervalPropagator} (closed form for n = 2, the zero-order hold of
 * (A, bRef) over tau otherwise; both exact because r is constant).
 */
final class ExactTrajectory {

    private final int n;
    private final double[] a;
    private final double[] bRef;
    private final double reference;
    private final double[] timeSeconds;
    private final double[] state;
    private final SubIntervalPropagator propagator;

    /**
     * Takes the arrays over without copying: the caller must not modify them afterwards.
     *
     * @param state row-major samples, x_i(t_k) at k n + i
     */
    ExactTrajectory(LinearLoop loop, double reference, double[] timeSeconds, double[] state,
                    SubIntervalPropagator propagator) {
        DMatrixRMaj aMatrix = loop.a();
        this.n = aMatrix.numRows;
        this.a = aMatrix.data;
        this.bRef = loop.bRef().data;
        this.reference = reference;
        this.timeSeconds = timeSeconds;
        this.state = state;
        this.propagator = propagator;
    }

    int sampleCount() {
        return timeSeconds.length;
    }

    int stateDimension() {
        return n;
    }

    double time(int sampleIndex) {
        return timeSeconds[sampleIndex];
    }

    /** Row-major samples (not copied: callers must not modify them). */
    double[] sampleStates() {
        return state;
    }

    /** Writes x(t) for t in [t_k, t_(k+1)] into target, propagated exactly from sample k. */
    void stateBetween(int sampleIndex, double tSeconds, double[] target) {
        double tau = tSeconds - timeSeconds[sampleIndex];
        int offset = sampleIndex * n;
        if (tau <= 0.0) {
            System.arraycopy(state, offset, target, 0, n);
            return;
        }
        propagator.propagate(state, offset, tau, target);
    }

    /**
     * For n = 2, fills values[k] = offset + w . x_k and rates[k] = w . (A x_k + bRef r) in one
     * pass, summed in the same order as {@link #rateAlong} and LinearSignal's value.
     */
    void sampleTwoStateSignal(double[] weights, double offset, double[] values, double[] rates) {
        double w0 = weights[0];
        double w1 = weights[1];
        double a00 = a[0];
        double a01 = a[1];
        double a10 = a[2];
        double a11 = a[3];
        double drive0 = bRef[0] * reference;
        double drive1 = bRef[1] * reference;
        double[] x = state;
        int count = values.length;
        for (int k = 0; k < count; k++) {
            double x0 = x[2 * k];
            double x1 = x[2 * k + 1];
            values[k] = offset + w0 * x0 + w1 * x1;
            double rate0 = drive0 + a00 * x0 + a01 * x1;
            double rate1 = drive1 + a10 * x0 + a11 * x1;
            rates[k] = 0.0 + w0 * rate0 + w1 * rate1;
        }
    }

    /** w . x' = sum_i w_i (bRef_i r + sum_j a_ij x_j), x at values[offset .. offset + n). */
    double rateAlong(double[] weights, double[] values, int offset) {
        double sum = 0.0;
        for (int i = 0; i < n; i++) {
            double rate = bRef[i] * reference;
            int row = i * n;
            for (int j = 0; j < n; j++) {
                rate += a[row + j] * values[offset + j];
            }
            sum += weights[i] * rate;
        }
        return sum;
    }
}
