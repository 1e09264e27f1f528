package com.loopwright.solver.simulation;

/**
 * A scalar signal s = w . x + offset along an {@link ExactTrajectory}, with its exact sample
 * values and time derivatives s' = w . (A x + bRef r), and the refinements that the step metrics
 * need between samples.
 *
 * <p>Assumption (enforced by the caller through the sample-density check): each sample interval
 * holds at most one critical point of s, so a sign change of s' between two samples marks the
 * single extremum inside, and s is monotone on each side of it.
 *
 * <p>Evaluations between samples reuse one scratch state and allocate nothing for n = 2, so an
 * instance serves one measurement in one thread.
 */
final class LinearSignal {

    /** A time and the signal value there. */
    record Point(double timeSeconds, double value) {
    }

    private final ExactTrajectory trajectory;
    private final double[] weights;
    private final double offset;
    private final double[] sampleValue;
    private final double[] sampleRate;
    /** x(t) between samples, reused by every evaluation. */
    private final double[] scratch;

    /** Takes over the recorded samples of a signal along the trajectory's samples. */
    LinearSignal(ExactTrajectory trajectory, SampledSignal samples) {
        if (samples.valueArray() == null || samples.valueArray().length != trajectory.sampleCount()) {
            throw new IllegalArgumentException("the signal was not recorded on this trajectory");
        }
        this.trajectory = trajectory;
        this.weights = samples.weights();
        this.offset = samples.offset();
        this.sampleValue = samples.valueArray();
        this.sampleRate = samples.rateArray();
        this.scratch = new double[trajectory.stateDimension()];
    }

    int sampleCount() {
        return sampleValue.length;
    }

    double sampleValue(int k) {
        return sampleValue[k];
    }

    double time(int k) {
        return trajectory.time(k);
    }

    /** offset + w . x, x at values[from .. from + n). */
    private double valueOf(double[] values, int from) {
        double sum = offset;
        for (int i = 0; i < weights.length; i++) {
            sum += weights[i] * values[from + i];
        }
        return sum;
    }

    /** s(t) for t in [t_k, t_(k+1)]. */
    double valueBetween(int k, double tSeconds) {
        trajectory.stateBetween(k, tSeconds, scratch);
        return valueOf(scratch, 0);
    }

    /** s'(t) for t in [t_k, t_(k+1)]. */
    double rateBetween(int k, double tSeconds) {
        trajectory.stateBetween(k, tSeconds, scratch);
        return trajectory.rateAlong(weights, scratch, 0);
    }

    /** Interval k has an interior maximum: s' goes from positive to negative. */
    boolean hasInteriorMaximum(int k) {
        return sampleRate[k] > 0.0 && sampleRate[k + 1] < 0.0;
    }

    /** Interval k has an interior minimum: s' goes from negative to positive. */
    boolean hasInteriorMinimum(int k) {
        return sampleRate[k] < 0.0 && sampleRate[k + 1] > 0.0;
    }

    /**
     * Upper estimate of an interior maximum on interval k of width h: if s' decreases across the
     * interval, s(t*) <= s_k + s'_k h and s(t*) <= s_(k+1) - s'_(k+1) h; a factor 2 on the
     * increments adds a margin for a non-monotone s'.
     */
    double interiorMaximumBound(int k) {
        double width = time(k + 1) - time(k);
        return Math.min(sampleValue[k] + 2.0 * sampleRate[k] * width,
            sampleValue[k + 1] - 2.0 * sampleRate[k + 1] * width);
    }

    /** Lower estimate of an interior minimum on interval k, mirror of the maximum bound. */
    double interiorMinimumBound(int k) {
        double width = time(k + 1) - time(k);
        return Math.max(sampleValue[k] + 2.0 * sampleRate[k] * width,
            sampleValue[k + 1] - 2.0 * sampleRate[k + 1] * width);
    }

    /** The critical point s'(t*) = 0 inside interval k, by Brent's method on the exact s'. */
    Point criticalPoint(int k) {
        double tStar = BracketedRoot.find(t -> rateBetween(k, t),
            time(k), time(k + 1), sampleRate[k], sampleRate[k + 1]);
        return new Point(tStar, valueBetween(k, tStar));
    }

    /**
     * The time in [loSeconds, hiSeconds] within interval k where s = level, given the signal
     * values at the bracket ends (they must straddle the level).
     */
    double crossing(int k, double level, double loSeconds, double valueAtLo, double hiSeconds,
                    double valueAtHi) {
        if (loSeconds == hiSeconds) {
            return loSeconds;
        }
        return BracketedRoot.find(t -> valueBetween(k, t) - level, loSeconds, hiSeconds,
            valueAtLo - level, valueAtHi - level);
    }

    /**
     * The global maximum of s over [0, horizon]: the largest sample, then every interior maximum
     * whose upper estimate could beat the best value so far, largest estimate first.
     */
    Point maximum() {
        return maximumOf(1.0);
    }

    /**
     * The global maximum of -s, as the time and the value of -s there: the maximum of the signal
     * with weights -w and offset -offset, bit for bit (rounding to nearest is symmetric under
     * negation, so its sample values, rates, bounds and Brent iterates are exactly those of s
     * with the sign changed), without building that signal's arrays.
     */
    Point maximumOfNegation() {
        return maximumOf(-1.0);
    }

    /** The maximum of sign s for sign = +1 or -1 (multiplying by either is exact). */
    private Point maximumOf(double sign) {
        int count = sampleCount();
        // One pass: the largest sample, and every interval with an interior maximum whose bound
        // beats the best sample so far (a superset of those beating the final best, which are
        // kept below). The best value is kept in a local: comparing against
        // sampleValue[bestSample] would make each step wait for a dependent load.
        int bestSample = 0;
        double bestValue = sign * sampleValue[0];
        double previousRate = sign * sampleRate[0];
        int[] candidates = new int[8];
        int candidateCount = 0;
        for (int k = 1; k < count; k++) {
            double rate = sign * sampleRate[k];
            if (previousRate > 0.0 && rate < 0.0 && signedMaximumBound(k - 1, sign) > bestValue) {
                if (candidateCount == candidates.length) {
                    candidates = java.util.Arrays.copyOf(candidates, 2 * candidateCount);
                }
                candidates[candidateCount++] = k - 1;
            }
            previousRate = rate;
            double value = sign * sampleValue[k];
            if (value > bestValue) {
                bestValue = value;
                bestSample = k;
            }
        }
        Point best = new Point(time(bestSample), bestValue);
        int kept = 0;
        for (int i = 0; i < candidateCount; i++) {
            if (signedMaximumBound(candidates[i], sign) > bestValue) {
                kept++;
            }
        }
        if (kept == 0) {
            return best;
        }
        Integer[] order = new Integer[kept];
        for (int i = 0, found = 0; i < candidateCount; i++) {
            if (signedMaximumBound(candidates[i], sign) > bestValue) {
                order[found++] = candidates[i];
            }
        }
        java.util.Arrays.sort(order,
            (p, q) -> Double.compare(signedMaximumBound(q, sign), signedMaximumBound(p, sign)));
        for (int k : order) {
            if (signedMaximumBound(k, sign) <= best.value()) {
                break;
            }
            double tStar = BracketedRoot.find(t -> sign * rateBetween(k, t),
                time(k), time(k + 1), sign * sampleRate[k], sign * sampleRate[k + 1]);
            Point refined = new Point(tStar, sign * valueBetween(k, tStar));
            if (refined.value() > best.value()) {
                best = refined;
            }
        }
        return best;
    }

    /** Interval k has an interior maximum of sign s. */
    private boolean hasInteriorMaximum(int k, double sign) {
        return sign * sampleRate[k] > 0.0 && sign * sampleRate[k + 1] < 0.0;
    }

    /** {@link #interiorMaximumBound} of sign s. */
    private double signedMaximumBound(int k, double sign) {
        double width = time(k + 1) - time(k);
        return Math.min(sign * sampleValue[k] + 2.0 * (sign * sampleRate[k]) * width,
            sign * sampleValue[k + 1] - 2.0 * (sign * sampleRate[k + 1]) * width);
    }

    /**
     * The first time s reaches the level (s(0) below it), or -1 if it does not within the
     * horizon.
     */
    double firstTimeReaching(double level) {
        if (sampleValue[0] >= level) {
            return time(0);
        }
        for (int k = 0; k < sampleCount() - 1; k++) {
            if (hasInteriorMaximum(k) && interiorMaximumBound(k) >= level) {
                Point peak = criticalPoint(k);
                if (peak.value() >= level) {
                    // s rises monotonically from t_k to the peak
                    return crossing(k, level, time(k), sampleValue[k], peak.timeSeconds(),
                        peak.value());
                }
            }
            if (sampleValue[k + 1] >= level) {
                return crossing(k, level, time(k), sampleValue[k], time(k + 1),
                    sampleValue[k + 1]);
            }
        }
        return -1.0;
    }

    /**
     * The last time |s - centre| exceeds halfWidth, scanning back from the horizon, or -1 if s is
     * outside the band at the last sample.
     */
    double lastTimeOutsideBand(double centre, double halfWidth) {
        double upper = centre + halfWidth;
        double lower = centre - halfWidth;
        int last = sampleCount() - 1;
        if (Math.abs(sampleValue[last] - centre) > halfWidth) {
            return -1.0;
        }
        for (int k = last - 1; k >= 0; k--) {
            // Exit after an interior extremum outside the band: s is monotone from t* to t_(k+1).
            if (hasInteriorMaximum(k) && interiorMaximumBound(k) > upper) {
                Point peak = criticalPoint(k);
                if (peak.value() > upper) {
                    return crossing(k, upper, peak.timeSeconds(), peak.value(), time(k + 1),
                        sampleValue[k + 1]);
                }
            }
            if (hasInteriorMinimum(k) && interiorMinimumBound(k) < lower) {
                Point trough = criticalPoint(k);
                if (trough.value() < lower) {
                    return crossing(k, lower, trough.timeSeconds(), trough.value(), time(k + 1),
                        sampleValue[k + 1]);
                }
            }
            if (Math.abs(sampleValue[k] - centre) > halfWidth) {
                double level = sampleValue[k] > centre ? upper : lower;
                return crossing(k, level, time(k), sampleValue[k], time(k + 1),
                    sampleValue[k + 1]);
            }
        }
        return time(0);
    }
}
