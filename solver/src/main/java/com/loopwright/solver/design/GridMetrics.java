package com.loopwright.solver.design;

/**
 * Step metrics of a dense trajectory (saturated, sampled or delayed loops, where the exact event refinement of the
 * linear simulation does not apply). Level crossings are interpolated linearly between grid points; the overshoot
 * and the peak control are the largest grid values, so their error is of second order in the grid step.
 *
 * @param riseTimeSeconds     10-90% rise time of x1 towards the final value, or null if 90% is not reached
 * @param settlingTimeSeconds last exit from the settling band, or null if x1 is outside it at the horizon
 * @param overshootPercent    100 (max x1 / y_inf - 1), at least 0
 * @param peakControl         max |u| applied to the plant
 */
public record GridMetrics(
        Double riseTimeSeconds, Double settlingTimeSeconds, double overshootPercent, double peakControl) {

    /**
     * @param finalValue   y_inf, non-zero
     * @param bandFraction settling band as a fraction of |y_inf|
     */
    public static GridMetrics of(DenseTrajectory trajectory, double finalValue, double bandFraction) {
        double[] t = trajectory.timeSeconds();
        double[] y = trajectory.x1();
        double[] u = trajectory.control();
        int n = t.length;
        double[] z = new double[n];
        double peak = Double.NEGATIVE_INFINITY;
        double peakControl = 0;
        for (int i = 0; i < n; i++) {
            z[i] = y[i] / finalValue;
            peak = Math.max(peak, z[i]);
            peakControl = Math.max(peakControl, Math.abs(u[i]));
        }
        Double riseStart = firstReaching(t, z, 0.1);
        Double riseEnd = firstReaching(t, z, 0.9);
        Double rise = riseStart == null || riseEnd == null ? null : riseEnd - riseStart;
        Double settling;
        if (Math.abs(z[n - 1] - 1) > bandFraction) {
            settling = null;
        } else {
            int last = -1;
            for (int i = n - 2; i >= 0; i--) {
                if (Math.abs(z[i] - 1) > bandFraction) {
                    last = i;
                    break;
                }
            }
            if (last < 0) {
                settling = 0.0;
            } else {
                // |z - 1| crosses the band between grid points last and last + 1
                double e0 = Math.abs(z[last] - 1) - bandFraction;
                double e1 = Math.abs(z[last + 1] - 1) - bandFraction;
                settling = t[last] + (t[last + 1] - t[last]) * e0 / (e0 - e1);
            }
        }
        return new GridMetrics(rise, settling, Math.max(0, 100 * (peak - 1)), peakControl);
    }

    private static Double firstReaching(double[] t, double[] z, double level) {
        for (int i = 1; i < t.length; i++) {
            if (z[i] >= level) {
                double fraction = (level - z[i - 1]) / (z[i] - z[i - 1]);
                return t[i - 1] + (t[i] - t[i - 1]) * Math.max(0, Math.min(1, fraction));
            }
        }
        return null;
    }
}
