package com.loopwright.solver.simulation;

/**
 * The first time a signal reaches a level (its first sample below it), in one forward pass: the
 * first interval k where an interior maximum's bound reaches the level and its refined peak does
 * (then s rises monotonically from t_k to the peak, and the crossing is on [t_k, t*]), or where
 * s_(k+1) >= level (crossing on [t_k, t_(k+1)]). The refinement runs when interval k is seen,
 * from its x_k; nothing is stored.
 */
final class RiseScan {

    private final SignalBetweenSamples signal;
    private final double level;
    private boolean done;
    private double timeSeconds = -1.0;

    RiseScan(SignalBetweenSamples signal, double level) {
        this.signal = signal;
        this.level = level;
    }

    /** Sample 0: reached at t_0 if s_0 >= level. */
    void firstSample(double value) {
        if (value >= level) {
            timeSeconds = signal.time(0);
            done = true;
        }
    }

    /** Interval k from x_k = state[0 .. n) with the end values and rates of s. */
    void interval(int k, double[] state, double valueAtStart, double rateAtStart,
                  double valueAtEnd, double rateAtEnd) {
        // The per-sample test stays small; the rare refinements are separate methods.
        if (done) {
            return;
        }
        if (rateAtStart > 0.0 && rateAtEnd < 0.0
            && reachedAtPeak(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd)) {
            return;
        }
        if (valueAtEnd >= level) {
            reachedAtEnd(k, state, valueAtStart, valueAtEnd);
        }
    }

    /** Interval k has an interior maximum: finishes and returns true if its peak reaches the level. */
    private boolean reachedAtPeak(int k, double[] state, double valueAtStart, double rateAtStart,
                                  double valueAtEnd, double rateAtEnd) {
        if (SignalBetweenSamples.interiorMaximumBound(signal.time(k + 1) - signal.time(k),
            valueAtStart, rateAtStart, valueAtEnd, rateAtEnd) >= level) {
            double peakTime = signal.criticalTime(k, state, 0, rateAtStart, rateAtEnd);
            double peakValue = signal.valueBetween(k, state, 0, peakTime);
            if (peakValue >= level) {
                finish(signal.crossing(k, state, 0, level, signal.time(k), valueAtStart, peakTime,
                    peakValue));
                return true;
            }
        }
        return false;
    }

    /** s_(k+1) reaches the level: the crossing on [t_k, t_(k+1)]. */
    private void reachedAtEnd(int k, double[] state, double valueAtStart, double valueAtEnd) {
        finish(signal.crossing(k, state, 0, level, signal.time(k), valueAtStart,
            signal.time(k + 1), valueAtEnd));
    }

    /** Stops scanning (the pass has failed and will report why). */
    void abandon() {
        done = true;
    }

    private void finish(double crossingSeconds) {
        timeSeconds = crossingSeconds;
        done = true;
    }

    /** The first time s reaches the level, or -1 if it does not within the horizon. */
    double timeSeconds() {
        return timeSeconds;
    }
}
