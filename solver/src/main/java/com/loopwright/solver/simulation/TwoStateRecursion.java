package com.loopwright.solver.simulation;

/**
 * The zero-order-hold step recursion unrolled for two states, the hot path of every second-order simulation:
 * x_(k+1) = Ad x_k + drive with x_0 = 0, y_k = 0 + c0 x0 + c1 x1, u_k = feedthrough + k0 x0 + k1 x1. The state
 * stays in locals; each sample goes to an {@link Observer} (no allocation per sample).
 *
 * <p>Invariant: the same operations in the same order as {@link StateRecursion} for n = 2 (drive_i first, then
 * ad_i0 x0, then ad_i1 x1), so both give the same numbers bit for bit.
 */
final class TwoStateRecursion {

    /** Receives sample k: the state and the output and control computed from it. */
    @FunctionalInterface
    interface Observer {
        void accept(int k, double x0, double x1, double output, double control);
    }

    private final double ad00;
    private final double ad01;
    private final double ad10;
    private final double ad11;
    private final double drive0;
    private final double drive1;
    private final double c0;
    private final double c1;
    private final double k0;
    private final double k1;
    private final double feedthrough;

    /**
     * @param ad       Ad row-major (4 entries)
     * @param drive    Bd r (2 entries)
     * @param cOut     output row c (2 entries)
     * @param cControl control row k (2 entries)
     */
    TwoStateRecursion(double[] ad, double[] drive, double[] cOut, double[] cControl, double feedthrough) {
        this.ad00 = ad[0];
        this.ad01 = ad[1];
        this.ad10 = ad[2];
        this.ad11 = ad[3];
        this.drive0 = drive[0];
        this.drive1 = drive[1];
        this.c0 = cOut[0];
        this.c1 = cOut[1];
        this.k0 = cControl[0];
        this.k1 = cControl[1];
        this.feedthrough = feedthrough;
    }

    /** Runs samples 0 .. samples - 1 (the caller caps samples); returns the running sum of y + u. */
    double run(int samples, Observer observer) {
        double ad00 = this.ad00;
        double ad01 = this.ad01;
        double ad10 = this.ad10;
        double ad11 = this.ad11;
        double drive0 = this.drive0;
        double drive1 = this.drive1;
        double x0 = 0.0;
        double x1 = 0.0;
        double guard = 0.0;
        for (int k = 0; k < samples; k++) {
            if (k > 0) {
                double next0 = drive0 + ad00 * x0 + ad01 * x1;
                double next1 = drive1 + ad10 * x0 + ad11 * x1;
                x0 = next0;
                x1 = next1;
            }
            double y = 0.0 + c0 * x0 + c1 * x1;
            double u = feedthrough + k0 * x0 + k1 * x1;
            guard += y + u;
            observer.accept(k, x0, x1, y, u);
        }
        return guard;
    }
}
