package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/** x+ = Ad x + Bd v for a two-state, one-input hold; checks that the state stays finite. */
public final class CheckedHoldStep {

    private CheckedHoldStep() {}

    public static double[] apply(DiscreteStateSpace hold, double[] x, double input) {
        DMatrixRMaj ad = hold.ad();
        DMatrixRMaj bd = hold.bd();
        return apply(ad, bd, x, input);
    }

    public static double[] apply(DMatrixRMaj ad, DMatrixRMaj bd, double[] x, double input) {
        double y0 = ad.unsafe_get(0, 0) * x[0] + ad.unsafe_get(0, 1) * x[1] + bd.unsafe_get(0, 0) * input;
        double y1 = ad.unsafe_get(1, 0) * x[0] + ad.unsafe_get(1, 1) * x[1] + bd.unsafe_get(1, 0) * input;
        if (!Double.isFinite(y0) || !Double.isFinite(y1)) {
            throw new IllegalArgumentException("the simulated state overflows double precision: the loop diverges");
        }
        return new double[] {y0, y1};
    }
}
