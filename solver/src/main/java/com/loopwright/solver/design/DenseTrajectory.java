package com.loopwright.solver.design;

/**
 * A simulated trajectory on a dense, strictly increasing time grid: states, the control applied to the plant,
 * and the disturbance. Arrays are copied in and out.
 */
public record DenseTrajectory(double[] timeSeconds, double[] x1, double[] x2, double[] control, double[] disturbance) {

    public DenseTrajectory {
        int n = timeSeconds.length;
        if (n < 2 || x1.length != n || x2.length != n || control.length != n || disturbance.length != n) {
            throw new IllegalArgumentException("trajectory arrays must have the same length >= 2");
        }
        timeSeconds = timeSeconds.clone();
        x1 = x1.clone();
        x2 = x2.clone();
        control = control.clone();
        disturbance = disturbance.clone();
    }

    @Override
    public double[] timeSeconds() {
        return timeSeconds.clone();
    }

    @Override
    public double[] x1() {
        return x1.clone();
    }

    @Override
    public double[] x2() {
        return x2.clone();
    }

    @Override
    public double[] control() {
        return control.clone();
    }

    @Override
    public double[] disturbance() {
        return disturbance.clone();
    }

    public int length() {
        return timeSeconds.length;
    }

    /**
     * The trajectory at {@code points} indices spread evenly over the grid (first and last included), for plots.
     * Decimation picks samples, it does not average them.
     */
    public DenseTrajectory decimate(int points) {
        int n = timeSeconds.length;
        if (points < 2) {
            throw new IllegalArgumentException("points must be at least 2, got " + points);
        }
        if (points >= n) {
            return this;
        }
        double[][] out = new double[5][points];
        double[][] in = {timeSeconds, x1, x2, control, disturbance};
        for (int i = 0; i < points; i++) {
            int index = (int) Math.round((double) i * (n - 1) / (points - 1));
            for (int s = 0; s < 5; s++) {
                out[s][i] = in[s][index];
            }
        }
        return new DenseTrajectory(out[0], out[1], out[2], out[3], out[4]);
    }
}
