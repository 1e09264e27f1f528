package com.loopwright.solver.simulation;

import java.util.Arrays;

/**
 * The first times a signal reaches ascending levels (its first sample below them), in one
 * forward pass: for each level, the first interval k where an interior maximum's bound reaches
 * the level and its refined peak does (then s rises monotonically from t_k to the peak, and the
 * crossing is on [t_k, t*]), or where s_(k+1) >= level (crossing on [t_k, t_(k+1)]). The
 * refinement runs when interval k is seen, from its x_k; nothing is stored.
 *
 * <p>The levels are scanned one after the other, each from the interval where the one below was
 * reached: both tests are monotone in the level, so a higher level is never reached in an earlier
 * interval, and before that interval its tests either fail or repeat (bit for bit) a peak
 * refinement of the level below. A failure of a refinement (an exception) ends the scan and is
 * kept for the caller, which reports it after the pass; later levels are then not scanned, as a
 * level-by-level scan would not reach them.
 */
final class RiseScan {

    private final SignalBetweenSamples signal;
    private final double[] levels;
    private final double[] timeSeconds;
    /** The level being scanned; levels.length when done. */
    private int current;

    private double level;
    private RuntimeException failure;

    RiseScan(SignalBetweenSamples signal, double... ascendingLevels) {
        for (int i = 1; i < ascendingLevels.length; i++) {
            if (!(ascendingLevels[i] > ascendingLevels[i - 1])) {
                throw new IllegalArgumentException("levels must be ascending");
            }
        }
        this.signal = signal;
        this.levels = ascendingLevels.clone();
        this.timeSeconds = new double[levels.length];
        Arrays.fill(timeSeconds, -1.0);
        this.level = levels.length > 0 ? levels[0] : Double.NaN;
    }

    /** Sample 0: each level with s_0 >= level is reached at t_0. */
    void firstSample(double value) {
        while (current < levels.length && value >= level) {
            finish(signal.time(0));
        }
    }

    /** Interval k from x_k = state[0 .. n) with the end values and rates of s. */
    void interval(int k, double[] state, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        // The per-sample test stays small; the rare refinements are a separate method.
        if (current < levels.length && (valueAtEnd >= level || rateAtStart > 0.0 && rateAtEnd < 0.0)) {
            refine(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd);
        }
    }

    /** Interval k for the current level and, once it is reached, for the levels above it. */
    private void refine(
            int k, double[] state, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        try {
            boolean reached = true;
            while (current < levels.length && reached) {
                reached = false;
                if (rateAtStart > 0.0
                        && rateAtEnd < 0.0
                        && SignalBetweenSamples.interiorMaximumBound(
                                        signal.time(k + 1) - signal.time(k),
                                        valueAtStart,
                                        rateAtStart,
                                        valueAtEnd,
                                        rateAtEnd)
                                >= level) {
                    double peakTime = signal.criticalTime(k, state, 0, rateAtStart, rateAtEnd);
                    double peakValue = signal.valueBetween(k, state, 0, peakTime);
                    if (peakValue >= level) {
                        // s rises monotonically from t_k to the peak
                        finish(signal.crossing(k, state, 0, level, signal.time(k), valueAtStart, peakTime, peakValue));
                        reached = true;
                        continue;
                    }
                }
                if (valueAtEnd >= level) {
                    finish(signal.crossing(
                            k, state, 0, level, signal.time(k), valueAtStart, signal.time(k + 1), valueAtEnd));
                    reached = true;
                }
            }
        } catch (RuntimeException e) {
            failure = e;
            current = levels.length;
        }
    }

    /** Stops scanning (the pass has failed and will report why). */
    void abandon() {
        current = levels.length;
    }

    private void finish(double crossingSeconds) {
        timeSeconds[current] = crossingSeconds;
        current++;
        level = current < levels.length ? levels[current] : Double.NaN;
    }

    /** The exception a refinement threw during the pass, or null. */
    RuntimeException failure() {
        return failure;
    }

    /** The first time s reaches level i, or -1 if it does not within the horizon. */
    double timeSeconds(int i) {
        return timeSeconds[i];
    }
}
