package com.loopwright.solver.simulation;

/**
 * The zero-order-hold step recursion for any number of states: x_(k+1) = Ad x_k + drive with x_0 = 0,
 * row i is drive_i plus sum_j ad_ij x_j in that order; y_k = 0 + sum_j c_j x_j, u_k = feedthrough + sum_j k_j x_j.
 * Each sample goes to an {@link Observer}; x_k and x_(k-1) alternate between two arrays allocated once, so x_k
 * stays unchanged until the observer's call for sample k + 1 returns.
 */
final class StateRecursion {

    /** Receives sample k: the state (read-only, reused two samples later) and the output and control. */
    @FunctionalInterface
    interface Observer {
        void accept(int k, double[] state, double output, double control);
    }

    private final int n;
    private final double[] ad;
    private final double[] drive;
    private final double[] cOut;
    private final double[] cControl;
    private final double feedthrough;

    /** The arrays are read, not copied: the caller hands over fresh ones. */
    StateRecursion(int n, double[] ad, double[] drive, double[] cOut, double[] cControl, double feedthrough) {
        this.n = n;
        this.ad = ad;
        this.drive = drive;
        this.cOut = cOut;
        this.cControl = cControl;
        this.feedthrough = feedthrough;
    }

    /** Runs samples 0 .. samples - 1 (the caller caps samples); returns the running sum of y + u. */
    double run(int samples, Observer observer) {
        double[] state = new double[n];
        double[] next = new double[n];
        double guard = 0.0;
        for (int k = 0; k < samples; k++) {
            if (k > 0) {
                for (int i = 0; i < n; i++) {
                    double sum = drive[i];
                    int adRow = i * n;
                    for (int j = 0; j < n; j++) {
                        sum += ad[adRow + j] * state[j];
                    }
                    next[i] = sum;
                }
                double[] swap = state;
                state = next;
                next = swap;
            }
            double y = 0.0;
            double u = feedthrough;
            for (int j = 0; j < n; j++) {
                y += cOut[j] * state[j];
                u += cControl[j] * state[j];
            }
            guard += y + u;
            observer.accept(k, state, y, u);
        }
        return guard;
    }
}
