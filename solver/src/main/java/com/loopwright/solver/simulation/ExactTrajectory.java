package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/**
 * The exact continuous solution of x' = A x + bRef r between the samples of a step response:
 * x(t_k + tau) from a sample state x_k by a {@link SubIntervalPropagator} (closed form for n = 2,
 * the zero-order hold of (A, bRef) over tau otherwise; both exact because r is constant). It keeps
 * no samples: the caller passes the x_k it stored for the interval.
 */
final class ExactTrajectory {

    private final int n;
    private final double[] a;
    private final double[] bRef;
    private final double reference;
    private final double horizonSeconds;
    private final double intervals;
    private final SubIntervalPropagator propagator;

    /**
     * @param horizonSeconds last sample time; t_k = horizon (k / (sampleCount - 1)), the
     *     expression of {@link StepSimulator}
     * @param sampleCount number of samples on [0, horizon], at least 2
     */
    ExactTrajectory(
            LinearLoop loop,
            double reference,
            double horizonSeconds,
            int sampleCount,
            SubIntervalPropagator propagator) {
        DMatrixRMaj aMatrix = loop.a();
        this.n = aMatrix.numRows;
        this.a = aMatrix.data;
        this.bRef = loop.bRef().data;
        this.reference = reference;
        this.horizonSeconds = horizonSeconds;
        this.intervals = sampleCount - 1;
        this.propagator = propagator;
    }

    int stateDimension() {
        return n;
    }

    double time(int sampleIndex) {
        return horizonSeconds * (sampleIndex / intervals);
    }

    /**
     * Writes x(t) for t in [t_k, t_(k+1)] into target, propagated exactly from
     * x_k = state[offset .. offset + n).
     */
    void stateBetween(int sampleIndex, double[] state, int offset, double tSeconds, double[] target) {
        double tau = tSeconds - time(sampleIndex);
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
