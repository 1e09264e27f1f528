package com.loopwright.solver.frequency;

import com.loopwright.solver.numeric.Bisection;
import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;

/**
 * Bode data and gain/phase margins of an open loop on a logarithmic grid, crossings refined by bisection (at most Bisection.MAX_ITERATIONS halvings each):
 * the gain crossover solves |L(j w)| - 1 = 0, the phase crossover solves Im L(j w) = 0 with Re L(j w) &lt; 0
 * (the negative real axis, so no phase unwrapping is involved in the margins).
 */
public final class LoopFrequencyAnalyzer {

    /** Largest number of grid points. */
    public static final int MAX_POINTS = 4000;
    /** Smallest number of grid points. */
    public static final int MIN_POINTS = 2;

    /** Samples L(j w) on {@code points} log-spaced frequencies from {@code lowRadPerSec} to {@code highRadPerSec}. */
    public BodeSeries sample(RationalLoop loop, double lowRadPerSec, double highRadPerSec, int points) {
        double[] w = grid(lowRadPerSec, highRadPerSec, points);
        double[] magnitude = new double[points];
        double[] phase = new double[points];
        for (int i = 0; i < points; i++) {
            double[] l = loop.at(w[i]);
            magnitude[i] = 20 * Math.log10(Math.hypot(l[0], l[1]));
            double wrapped = Math.toDegrees(Math.atan2(l[1], l[0]));
            if (i == 0) {
                // Start in (-360, 0]: the convention for loops with integrators and lags.
                phase[i] = wrapped > 0 ? wrapped - 360 : wrapped;
            } else {
                // Unwrap: choose the branch nearest the previous sample.
                double step = wrapped - phase[i - 1];
                phase[i] = wrapped - 360 * Math.rint(step / 360);
            }
            if (!Double.isFinite(magnitude[i]) || !Double.isFinite(phase[i])) {
                throw new IllegalArgumentException("L(jw) is not finite at w = " + w[i] + " rad/s (a pole on the axis)");
            }
        }
        return new BodeSeries(w, magnitude, phase);
    }

    /** Margins from the lowest crossings in the window, bracketed on the grid and refined by bisection. */
    public StabilityMargins margins(RationalLoop loop, double lowRadPerSec, double highRadPerSec, int points) {
        double[] w = grid(lowRadPerSec, highRadPerSec, points);
        DoubleUnaryOperator logGain = x -> {
            double[] l = loop.at(x);
            return Math.log(Math.hypot(l[0], l[1]));
        };
        DoubleUnaryOperator imaginary = x -> loop.at(x)[1];
        OptionalDouble gainCrossover = firstRoot(w, logGain, x -> true);
        OptionalDouble phaseCrossover = firstRoot(w, imaginary, x -> loop.at(x)[0] < 0);
        OptionalDouble phaseMargin = OptionalDouble.empty();
        if (gainCrossover.isPresent()) {
            double[] l = loop.at(gainCrossover.getAsDouble());
            double arg = Math.toDegrees(Math.atan2(l[1], l[0]));
            phaseMargin = OptionalDouble.of(180 + (arg > 0 ? arg - 360 : arg));
        }
        OptionalDouble gainMargin = OptionalDouble.empty();
        if (phaseCrossover.isPresent()) {
            double[] l = loop.at(phaseCrossover.getAsDouble());
            gainMargin = OptionalDouble.of(-20 * Math.log10(Math.abs(l[0])));
        }
        return new StabilityMargins(gainCrossover, phaseMargin, phaseCrossover, gainMargin);
    }

    private static OptionalDouble firstRoot(double[] w, DoubleUnaryOperator f,
                                            java.util.function.DoublePredicate accept) {
        double previous = f.applyAsDouble(w[0]);
        for (int i = 1; i < w.length; i++) {
            double current = f.applyAsDouble(w[i]);
            if (previous == 0 && accept.test(w[i - 1])) {
                return OptionalDouble.of(w[i - 1]);
            }
            if (previous * current < 0) {
                double root = Bisection.root(f, w[i - 1], w[i]);
                if (accept.test(root)) {
                    return OptionalDouble.of(root);
                }
            }
            previous = current;
        }
        return OptionalDouble.empty();
    }

    static double[] grid(double low, double high, int points) {
        if (!(low > 0) || !Double.isFinite(high) || !(high > low)) {
            throw new IllegalArgumentException("need 0 < low < high, finite; got " + low + ", " + high);
        }
        if (points < MIN_POINTS || points > MAX_POINTS) {
            throw new IllegalArgumentException("points must be in [" + MIN_POINTS + ", " + MAX_POINTS + "]");
        }
        double[] w = new double[points];
        double logLow = Math.log(low);
        double span = Math.log(high) - logLow;
        for (int i = 0; i < points; i++) {
            w[i] = Math.exp(logLow + span * i / (points - 1));
        }
        w[0] = low;
        w[points - 1] = high;
        return w;
    }
}
