package com.loopwright.solver.frequency;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;

/**
 * Independent route to the margins of any rational loop: a dense logarithmic grid, every crossing refined by the
 * bracketing Brent solver of Hipparchus (reference library). The gain crossovers solve ln |L(j w)| = 0, the phase
 * crossovers Im L(j w) = 0 with Re L(j w) &lt; 0 (the negative real axis, so no phase unwrapping is involved).
 * The closed-form margins of {@link LoopFrequencyAnalyzer#margins} are checked against it.
 */
final class GridStabilityMargins {

    /** Least grid points when bracketing crossings (a crossing pair closer than one cell can be missed). */
    static final int MIN_SEARCH_POINTS = 4000;
    /** Most crossings of each kind kept. */
    static final int MAX_ROOTS = CrossoverMargins.MAX_CROSSOVERS;
    /** Brent refinement in ln w: relative and absolute accuracy, order, and evaluations per crossing. */
    static final double RELATIVE_ACCURACY = 1e-15;

    static final double ABSOLUTE_ACCURACY_LOG = 1e-15;
    static final int BRENT_ORDER = 5;
    static final int MAX_EVALUATIONS = 200;

    /**
     * Classical margins of an open loop L inside a frequency window, over every crossing in it.
     *
     * @param gainCrossoverRadPerSec  the w with |L(j w)| = 1 that sets the phase margin, if any in the window
     * @param phaseMarginDegrees      least destabilizing phase lag (see {@link CrossoverMargins})
     * @param delayMarginSeconds      least destabilizing input delay, min over crossovers of lag [rad] / w
     * @param phaseCrossoverRadPerSec where L(j w) crosses the negative real axis with the gain margin below
     * @param gainMarginDecibels      -20 log10 |L| there: the least positive one, else the one nearest 0 dB
     */
    record Margins(
            OptionalDouble gainCrossoverRadPerSec,
            OptionalDouble phaseMarginDegrees,
            OptionalDouble delayMarginSeconds,
            OptionalDouble phaseCrossoverRadPerSec,
            OptionalDouble gainMarginDecibels) {}

    private GridStabilityMargins() {}

    /**
     * Margins over every crossing in the window: the gain crossovers (log |L| = 0) and phase crossovers
     * (Im L = 0 with Re L &lt; 0) are bracketed on a log grid of at least {@value #MIN_SEARCH_POINTS} points and
     * refined by the bracketing Brent solver of Hipparchus in ln w. Phase and delay margins follow
     * {@link CrossoverMargins} with the closed-loop stability of 1 + L; the gain margin is the least
     * -20 log10 |L| above 0 dB over the phase crossovers, or when all of them have |L| &gt; 1, the one nearest 0 dB.
     */
    static Margins of(RationalLoop loop, double lowRadPerSec, double highRadPerSec, int points) {
        double[] w = LoopFrequencyAnalyzer.grid(lowRadPerSec, highRadPerSec, Math.max(points, MIN_SEARCH_POINTS));
        UnivariateFunction logGain = x -> {
            double[] l = loop.at(Math.exp(x));
            return Math.log(Math.hypot(l[0], l[1]));
        };
        UnivariateFunction imaginary = x -> {
            double[] l = loop.at(Math.exp(x));
            return l[1] / Math.hypot(l[0], l[1]);
        };
        List<Double> gainCrossovers = roots(w, logGain);
        double[] crossovers = new double[Math.min(gainCrossovers.size(), CrossoverMargins.MAX_CROSSOVERS)];
        double[] phases = new double[crossovers.length];
        for (int i = 0; i < crossovers.length; i++) {
            crossovers[i] = gainCrossovers.get(i);
            double[] l = loop.at(crossovers[i]);
            phases[i] = Math.atan2(l[1], l[0]);
        }
        Optional<CrossoverMargins> phaseMargins = CrossoverMargins.of(crossovers, phases, loop.closedLoopStable());
        OptionalDouble phaseCrossover = OptionalDouble.empty();
        OptionalDouble gainMargin = OptionalDouble.empty();
        for (double root : roots(w, imaginary)) {
            double[] l = loop.at(root);
            if (!(l[0] < 0)) {
                continue; // the positive real axis: not a -180 degree crossing
            }
            double margin = -20 * Math.log10(-l[0]);
            boolean better = gainMargin.isEmpty()
                    || (margin > 0
                            ? gainMargin.getAsDouble() <= 0 || margin < gainMargin.getAsDouble()
                            : gainMargin.getAsDouble() <= 0 && margin > gainMargin.getAsDouble());
            if (better) {
                gainMargin = OptionalDouble.of(margin);
                phaseCrossover = OptionalDouble.of(root);
            }
        }
        return new Margins(
                phaseMargins.map(m -> OptionalDouble.of(m.crossoverRadPerSec())).orElse(OptionalDouble.empty()),
                phaseMargins.map(m -> OptionalDouble.of(m.phaseMarginDegrees())).orElse(OptionalDouble.empty()),
                phaseMargins.map(m -> OptionalDouble.of(m.delayMarginSeconds())).orElse(OptionalDouble.empty()),
                phaseCrossover,
                gainMargin);
    }

    /** Every sign change of f(ln w) between grid neighbours, refined by Brent's method; at most MAX_ROOTS. */
    private static List<Double> roots(double[] w, UnivariateFunction f) {
        BracketingNthOrderBrentSolver solver =
                new BracketingNthOrderBrentSolver(RELATIVE_ACCURACY, ABSOLUTE_ACCURACY_LOG, 0, BRENT_ORDER);
        List<Double> roots = new ArrayList<>();
        double previous = f.value(Math.log(w[0]));
        if (previous == 0) {
            roots.add(w[0]);
        }
        for (int i = 1; i < w.length && roots.size() < MAX_ROOTS; i++) {
            double current = f.value(Math.log(w[i]));
            if (current == 0) {
                roots.add(w[i]);
            } else if (previous * current < 0) {
                roots.add(Math.exp(solver.solve(
                        MAX_EVALUATIONS, f, Math.log(w[i - 1]), Math.log(w[i]), AllowedSolution.ANY_SIDE)));
            }
            previous = current;
        }
        return roots;
    }
}
