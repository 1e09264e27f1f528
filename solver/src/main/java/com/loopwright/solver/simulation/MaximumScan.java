package com.loopwright.solver.simulation;

/**
 * The global maximum of a signal over [0, horizon] in one forward pass: the largest sample, and
 * every interval with an interior maximum whose upper bound beats the best sample seen before
 * its end (a superset of those beating the final best). At the end the intervals whose bound
 * beats the final best sample are refined, largest bound first, until no bound can beat the best
 * value so far.
 */
final class MaximumScan {

    /** A time and the signal value there. */
    record Point(double timeSeconds, double value) {}

    private final SignalBetweenSamples signal;
    private final IntervalStore candidates;
    private int bestSample;
    private double bestValue;

    /** The signal must carry the sign of the scanned quantity (values and rates passed signed). */
    MaximumScan(SignalBetweenSamples signal, int stateDimension) {
        this.signal = signal;
        this.candidates = new IntervalStore(stateDimension);
    }

    /** Sample 0. */
    void firstSample(double value) {
        bestSample = 0;
        bestValue = value;
    }

    /**
     * Interval k from x_k = state[0 .. n), then sample k + 1 (k = 0, 1, ... in order); values
     * and rates of the signed signal.
     */
    void interval(int k, double[] state, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        // The per-sample tests stay small; the rare candidate is handled in a separate method.
        if (rateAtStart > 0.0 && rateAtEnd < 0.0) {
            consider(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd);
        }
        if (valueAtEnd > bestValue) {
            bestValue = valueAtEnd;
            bestSample = k + 1;
        }
    }

    /** Interval k has an interior maximum: keeps it if its bound beats the best sample so far. */
    private void consider(
            int k, double[] state, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        double bound = SignalBetweenSamples.interiorMaximumBound(
                signal.time(k + 1) - signal.time(k), valueAtStart, rateAtStart, valueAtEnd, rateAtEnd);
        if (bound > bestValue) {
            candidates.add(k, state, valueAtStart, rateAtStart, valueAtEnd, rateAtEnd, bound);
        }
    }

    /** The maximum: the best sample, improved by the refined interior maxima. */
    Point maximum() {
        Point best = new Point(signal.time(bestSample), bestValue);
        candidates.keepKeysAbove(bestValue);
        if (candidates.size() == 0) {
            return best;
        }
        double[] states = candidates.states();
        for (int entry : candidates.orderByKeyDescending()) {
            if (candidates.key(entry) <= best.value()) {
                break;
            }
            int k = candidates.sampleIndex(entry);
            int from = candidates.stateOffset(entry);
            double tStar =
                    signal.criticalTime(k, states, from, candidates.rateAtStart(entry), candidates.rateAtEnd(entry));
            Point refined = new Point(tStar, signal.valueBetween(k, states, from, tStar));
            if (refined.value() > best.value()) {
                best = refined;
            }
        }
        return best;
    }
}
