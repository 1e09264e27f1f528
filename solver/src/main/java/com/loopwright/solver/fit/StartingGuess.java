package com.loopwright.solver.fit;

import com.loopwright.solver.spec.OvershootDamping;

/**
 * A starting point read off the record: the gain from the final value, the damping ratio from the overshoot
 * (1 when there is none), the natural frequency from the time of the peak or, without overshoot, of the 50%
 * crossing, given a dead time.
 */
final class StartingGuess {

    /** Overshoot (fraction of the change) above which the peak sets the damping ratio. */
    private static final double MIN_OVERSHOOT = 0.02;
    /** wn t at which the critically damped unit step reaches 50% (root of 1 - (1 + x) e^-x = 1/2). */
    private static final double CRITICAL_HALF_RISE = 1.678;
    /** Shortest time the guesses divide by [s]. */
    private static final double MIN_TIME = 1e-12;

    private final double y0;
    private final double gain;
    private final double overshoot;
    private final double peakSeconds;
    private final double halfRiseSeconds;

    /**
     * @param afterStep index of the first sample at or after the step
     * @param y0        initial value guess
     * @param change    final minus initial value guess (non-zero)
     */
    StartingGuess(double[] t, double[] y, int afterStep, double stepTime, double y0, double change, double amplitude) {
        double peak = 0;
        int peakIndex = afterStep;
        for (int i = afterStep; i < t.length; i++) {
            double normalized = (y[i] - y0) / change;
            if (normalized > peak) {
                peak = normalized;
                peakIndex = i;
            }
        }
        this.y0 = y0;
        this.gain = change / amplitude;
        this.overshoot = peak - 1;
        this.peakSeconds = t[peakIndex] - stepTime;
        this.halfRiseSeconds = crossing(t, y, afterStep, y0, change, 0.5) - stepTime;
    }

    /** Time from the step to the first 50% crossing [s]. */
    double halfRiseSeconds() {
        return halfRiseSeconds;
    }

    /** {K, wn, zeta, (theta), (y0)} for the dead time deadTimeSeconds. */
    double[] point(double deadTimeSeconds, boolean withDeadTime, boolean withOffset) {
        double zeta;
        double wn;
        if (overshoot > MIN_OVERSHOOT && overshoot < 1) {
            zeta = OvershootDamping.dampingRatio(overshoot);
            wn = Math.PI / (Math.max(peakSeconds - deadTimeSeconds, MIN_TIME) * Math.sqrt(1 - zeta * zeta));
        } else {
            zeta = 1;
            wn = CRITICAL_HALF_RISE / Math.max(halfRiseSeconds - deadTimeSeconds, MIN_TIME);
        }
        double[] start = new double[3 + (withDeadTime ? 1 : 0) + (withOffset ? 1 : 0)];
        start[0] = gain;
        start[1] = wn;
        start[2] = zeta;
        if (withDeadTime) {
            start[3] = deadTimeSeconds;
        }
        if (withOffset) {
            start[start.length - 1] = y0;
        }
        return start;
    }

    /** First time the normalized response reaches the level (linear interpolation); the last time if never. */
    private static double crossing(double[] t, double[] y, int from, double y0, double change, double level) {
        for (int i = Math.max(from, 1); i < t.length; i++) {
            double previous = (y[i - 1] - y0) / change;
            double current = (y[i] - y0) / change;
            if (current >= level && i > from) {
                return previous >= level
                        ? t[i]
                        : t[i - 1] + (t[i] - t[i - 1]) * (level - previous) / (current - previous);
            }
        }
        return t[t.length - 1];
    }
}
