package com.loopwright.solver.simulation;

/**
 * The exact solution of x' = A x + bRef r (r constant) a time tau after a sample:
 * x(t_k + tau) from x_k. Implementations may keep scratch space, so an instance serves one
 * measurement in one thread.
 */
interface SubIntervalPropagator {

    /**
     * Writes x(t_k + tau) into target[0..n) from x_k = state[offset .. offset + n).
     *
     * @param tauSeconds time after the sample, finite and positive
     */
    void propagate(double[] state, int offset, double tauSeconds, double[] target);

    /**
     * The closed form for n = 2 ({@link TwoStatePropagator}, needs a Hurwitz A as the step
     * metrics check), the zero-order hold of (A, bRef) over tau otherwise.
     */
    static SubIntervalPropagator of(LinearLoop loop, double reference) {
        return loop.stateDimension() == 2
                ? new TwoStatePropagator(loop, reference)
                : new HoldPropagator(loop, reference);
    }
}
