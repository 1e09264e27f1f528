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
    private final double horizonSeconds;
    private final int sampleCount;
    private final double intervals;
    private final double[] state;
    private final SubIntervalPropagator propagator;

    /**
     * Takes the state array over without copying: the caller must not modify it afterwards.
     *
     * @param horizonSeconds last sample time; t_k = horizon (k / (sampleCount - 1)), the
     *     expression of {@link StepSimulator}
     * @param state row-major samples, x_i(t_k) at k n + i
     */
    ExactTrajectory(LinearLoop loop, double reference, double horizonSeconds, double[] state,
                    SubIntervalPropagator propagator) {
        DMatrixRMaj aMatrix = loop.a();
        this.n = aMatrix.numRows;
        this.a = aMatrix.data;
        this.bRef = loop.bRef().data;
        this.reference = reference;
        this.horizonSeconds = horizonSeconds;
        this.sampleCount = state.length / n;
        this.intervals = sampleCount - 1;
        this.state = state;
        this.propagator = propagator;
    }

    int sampleCount() {
        return sampleCount;
    }

    int stateDimension() {
        return n;
    }

    double time(int sampleIndex) {
        return horizonSeconds * (sampleIndex / intervals);
    }

    /** Writes x(t) for t in [t_k, t_(k+1)] into target, propagated exactly from sample k. */
    void stateBetween(int sampleIndex, double tSeconds, double[] target) {
        double tau = tSeconds - time(sampleIndex);
        int offset = sampleIndex * n;
        if (tau <= 0.0) {
            System.arraycopy(state, offset, target, 0, n);
            return;
        }
        propagator.propagate(state, offset, tau, target);
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
