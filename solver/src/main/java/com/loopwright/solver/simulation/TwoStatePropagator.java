package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/**
 * x(t_k + tau) = x_inf + e^(A tau) (x_k - x_inf) for n = 2, with the equilibrium
 * x_inf = -A^-1 bRef r (A Hurwitz, so invertible) and e^(A tau) from
 * {@link TwoStateExponential}. Exact because r is constant: e = x - x_inf obeys e' = A e.
 * Allocates nothing per call; not for concurrent use (one scratch matrix).
 */
final class TwoStatePropagator implements SubIntervalPropagator {

    private final TwoStateExponential exponential;
    private final double equilibrium0;
    private final double equilibrium1;
    private final double[] scratch = new double[4];

    TwoStatePropagator(LinearLoop loop, double reference) {
        if (loop.stateDimension() != 2) {
            throw new IllegalArgumentException("needs 2 states, got " + loop.stateDimension());
        }
        DMatrixRMaj a = loop.a();
        DMatrixRMaj bRef = loop.bRef();
        double a11 = a.get(0, 0);
        double a12 = a.get(0, 1);
        double a21 = a.get(1, 0);
        double a22 = a.get(1, 1);
        this.exponential = new TwoStateExponential(a11, a12, a21, a22);
        // x_inf = -A^-1 bRef r, A^-1 = [[a22, -a12], [-a21, a11]] / det A.
        double determinant = a11 * a22 - a12 * a21;
        double b0 = bRef.get(0, 0) * reference;
        double b1 = bRef.get(1, 0) * reference;
        this.equilibrium0 = -(a22 * b0 - a12 * b1) / determinant;
        this.equilibrium1 = -(a11 * b1 - a21 * b0) / determinant;
        if (!Double.isFinite(equilibrium0) || !Double.isFinite(equilibrium1)) {
            throw new IllegalArgumentException("A is singular: the equilibrium is not finite");
        }
    }

    @Override
    public void propagate(double[] state, int offset, double tauSeconds, double[] target) {
        double[] e = scratch;
        exponential.at(tauSeconds, e);
        double d0 = state[offset] - equilibrium0;
        double d1 = state[offset + 1] - equilibrium1;
        target[0] = equilibrium0 + (e[0] * d0 + e[1] * d1);
        target[1] = equilibrium1 + (e[2] * d0 + e[3] * d1);
    }
}
