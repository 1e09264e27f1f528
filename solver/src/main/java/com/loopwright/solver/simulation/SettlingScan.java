package com.loopwright.solver.simulation;

/**
 * The last time |s - centre| exceeds a half-width, in one forward pass (the backward scan from
 * the horizon, reordered): it keeps the latest sample k* outside the band (x_k*, s_k*,
 * s_(k*+1)) and, after it, every interval whose interior maximum bound is above the band or
 * interior minimum bound below it. A sample outside the band clears the intervals before it: the
 * backward scan tests interval k's interior before sample k, so once sample k* is outside, no
 * earlier interval is reached. At the end the listed intervals are refined latest first; the
 * first confirmed excursion gives the exit (s is monotone from the extremum to t_(k+1)), else
 * the crossing after sample k*. x_k* is copied only when sample k* + 1 is inside the band.
 */
final class SettlingScan {

    private final SignalBetweenSamples signal;
    private final double centre;
    private final double halfWidth;
    private final double upper;
    private final double lower;
    private final IntervalStore excursions;
    private final double[] stateOutside;
    private int lastOutside = -1;
    private double valueOutside;
    private double valueAfterOutside;
    private int lastSample;

    SettlingScan(SignalBetweenSamples signal, int stateDimension, double centre, double halfWidth) {
        this.signal = signal;
        this.centre = centre;
        this.halfWidth = halfWidth;
        this.upper = centre + halfWidth;
        this.lower = centre - halfWidth;
        this.excursions = new IntervalStore(stateDimension);
        this.stateOutside = new double[stateDimension];
    }

    /** Interval k (k = 0, 1, ... in order, each after sample k) from x_k = state[0 .. n). */
    void interval(int k, double[] state, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        // The per-sample tests stay small; the rare bookkeeping is in separate methods.
        if (k == lastOutside && !(Math.abs(valueAtEnd - centre) > halfWidth)) {
            keepLastOutside(state, valueAtEnd);
        }
        if (rateAtStart > 0.0 && rateAtEnd < 0.0) {
            considerMaximum(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd);
        } else if (rateAtStart < 0.0 && rateAtEnd > 0.0) {
            considerMinimum(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd);
        }
    }

    /**
     * Sample k + 1 is inside the band, so k may stay the last sample outside: keeps x_k and
     * s_(k+1). (While s stays outside, as on the rise, nothing is copied.)
     */
    private void keepLastOutside(double[] state, double valueAtEnd) {
        valueAfterOutside = valueAtEnd;
        System.arraycopy(state, 0, stateOutside, 0, stateOutside.length);
    }

    private void considerMaximum(
            int k, double[] state, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        if (SignalBetweenSamples.interiorMaximumBound(width(k), valueAtStart, rateAtStart, valueAtEnd, rateAtEnd)
                > upper) {
            excursions.add(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd, 0.0);
        }
    }

    private void considerMinimum(
            int k, double[] state, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        if (SignalBetweenSamples.interiorMinimumBound(width(k), valueAtStart, rateAtStart, valueAtEnd, rateAtEnd)
                < lower) {
            excursions.add(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd, 0.0);
        }
    }

    /** Sample k (k = 0, 1, ... in order, each after interval k - 1). */
    void sample(int k, double value) {
        lastSample = k;
        if (Math.abs(value - centre) > halfWidth) {
            lastOutside = k;
            valueOutside = value;
            if (excursions.size() != 0) {
                excursions.clear();
            }
        }
    }

    private double width(int k) {
        return signal.time(k + 1) - signal.time(k);
    }

    /** The exit time from the band, or -1 if s is outside it at the last sample. */
    double timeSeconds() {
        if (lastOutside == lastSample) {
            return -1.0;
        }
        for (int i = excursions.size() - 1; i >= 0; i--) {
            int k = excursions.sampleIndex(i);
            double[] states = excursions.states();
            int from = excursions.stateOffset(i);
            double valueAtStart = excursions.valueAtStart(i);
            double rateAtStart = excursions.rateAtStart(i);
            double valueAtEnd = excursions.valueAtEnd(i);
            double rateAtEnd = excursions.rateAtEnd(i);
            double level = rateAtStart > 0.0 ? upper : lower;
            double extremumTime = signal.criticalTime(k, states, from, rateAtStart, rateAtEnd);
            double extremumValue = signal.valueBetween(k, states, from, extremumTime);
            if (rateAtStart > 0.0 ? extremumValue > upper : extremumValue < lower) {
                return signal.crossing(
                        k, states, from, level, extremumTime, extremumValue, signal.time(k + 1), valueAtEnd);
            }
        }
        if (lastOutside >= 0) {
            double level = valueOutside > centre ? upper : lower;
            return signal.crossing(
                    lastOutside,
                    stateOutside,
                    0,
                    level,
                    signal.time(lastOutside),
                    valueOutside,
                    signal.time(lastOutside + 1),
                    valueAfterOutside);
        }
        return signal.time(0);
    }
}
