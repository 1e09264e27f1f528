package com.loopwright.solver.simulation;

import com.loopwright.solver.numeric.BracketedRoot;

/**
 * A scalar signal s = sign (w . x + offset) along an {@link ExactTrajectory}, evaluated between
 * samples from a stored sample state x_k, with the two refinements the step metrics need: the
 * critical point s'(t*) = 0 inside a sample interval and a level crossing, both by Brent's method
 * on the exact solution. sign is +1 or -1; multiplying by it is exact, so the signal with sign -1
 * is, bit for bit, the signal with weights -w and offset -offset.
 *
 * <p>Evaluations reuse one scratch state and allocate nothing for n = 2, so an instance serves
 * one measurement in one thread.
 */
final class SignalBetweenSamples {

    private final ExactTrajectory trajectory;
    private final double[] weights;
    private final double offset;
    private final double sign;
    /** x(t) between samples, reused by every evaluation. */
    private final double[] scratch;

    SignalBetweenSamples(ExactTrajectory trajectory, double[] weights, double offset, double sign) {
        this.trajectory = trajectory;
        this.weights = weights.clone();
        this.offset = offset;
        this.sign = sign;
        this.scratch = new double[trajectory.stateDimension()];
    }

    double time(int k) {
        return trajectory.time(k);
    }

    /** s(t) for t in [t_k, t_(k+1)], x_k at state[from .. from + n). */
    double valueBetween(int k, double[] state, int from, double tSeconds) {
        trajectory.stateBetween(k, state, from, tSeconds, scratch);
        double sum = offset;
        for (int i = 0; i < weights.length; i++) {
            sum += weights[i] * scratch[i];
        }
        return sign * sum;
    }

    /** s'(t) for t in [t_k, t_(k+1)], x_k at state[from .. from + n). */
    double rateBetween(int k, double[] state, int from, double tSeconds) {
        trajectory.stateBetween(k, state, from, tSeconds, scratch);
        return sign * trajectory.rateAlong(weights, scratch, 0);
    }

    /**
     * The time of the critical point s'(t*) = 0 inside interval k, from the sample rates
     * (which must differ in sign).
     */
    double criticalTime(int k, double[] state, int from, double rateAtStart, double rateAtEnd) {
        return BracketedRoot.brent(t -> rateBetween(k, state, from, t), time(k), time(k + 1), rateAtStart, rateAtEnd);
    }

    /**
     * The time in [loSeconds, hiSeconds] within interval k where s = level, given the signal
     * values at the bracket ends (they must straddle the level).
     */
    double crossing(
            int k,
            double[] state,
            int from,
            double level,
            double loSeconds,
            double valueAtLo,
            double hiSeconds,
            double valueAtHi) {
        if (loSeconds == hiSeconds) {
            return loSeconds;
        }
        return BracketedRoot.brent(
                t -> valueBetween(k, state, from, t) - level,
                loSeconds,
                hiSeconds,
                valueAtLo - level,
                valueAtHi - level);
    }

    /**
     * Upper estimate of an interior maximum on interval k from its end samples: if s' decreases
     * across the interval of width h, s(t*) <= s_k + s'_k h and s(t*) <= s_(k+1) - s'_(k+1) h; a
     * factor 2 on the increments adds a margin for a non-monotone s'.
     */
    static double interiorMaximumBound(
            double widthSeconds, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        return Math.min(valueAtStart + 2.0 * rateAtStart * widthSeconds, valueAtEnd - 2.0 * rateAtEnd * widthSeconds);
    }

    /** Lower estimate of an interior minimum on interval k, mirror of the maximum bound. */
    static double interiorMinimumBound(
            double widthSeconds, double valueAtStart, double rateAtStart, double valueAtEnd, double rateAtEnd) {
        return Math.max(valueAtStart + 2.0 * rateAtStart * widthSeconds, valueAtEnd - 2.0 * rateAtEnd * widthSeconds);
    }
}
