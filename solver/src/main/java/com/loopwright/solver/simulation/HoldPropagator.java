package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/**
 * x(t_k + tau) = Ad(tau) x_k + Bd(tau) r with Ad(tau), Bd(tau) the zero-order hold of (A, bRef)
 * over tau (exact because r is constant), for any n: one block exponential per call.
 */
final class HoldPropagator implements SubIntervalPropagator {

    private final DMatrixRMaj a;
    private final DMatrixRMaj bRef;
    private final double reference;

    HoldPropagator(LinearLoop loop, double reference) {
        this.a = loop.a();
        this.bRef = loop.bRef();
        this.reference = reference;
    }

    @Override
    public void propagate(double[] state, int offset, double tauSeconds, double[] target) {
        DiscreteStateSpace hold = ZeroOrderHold.discretize(a, bRef, tauSeconds);
        DMatrixRMaj ad = hold.ad();
        DMatrixRMaj bd = hold.bd();
        int n = a.numRows;
        for (int i = 0; i < n; i++) {
            double sum = bd.unsafe_get(i, 0) * reference;
            for (int j = 0; j < n; j++) {
                sum += ad.unsafe_get(i, j) * state[offset + j];
            }
            target[i] = sum;
        }
    }
}
