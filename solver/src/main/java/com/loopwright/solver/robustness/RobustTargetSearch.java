package com.loopwright.solver.robustness;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.numeric.GeometricBisection;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.TwoStateStepMetrics;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.function.Predicate;

/**
 * The nominal target (zeta, wn) whose gains meet the acceptance limits on every corner and every seeded Monte Carlo
 * sample of a parameter box, judged by the closed-form step metrics of each case ({@link TwoStateStepMetrics}).
 *
 * <p>The gains of a target on the nominal plant are those of the pole-matched design, k1 = (wn^2 - a0)/b,
 * k2 = (2 zeta wn - a1)/b, kr = wn^2/b; a case with parameters (a0', a1', b') then has the loop
 * s^2 + (a1' + b' k2) s + (a0' + b' k1) and the final value b' kr / (a0' + b' k1).
 *
 * <p>Search: damping ratios on a geometric grid of {@value #DAMPING_CANDIDATES} values from the requested one to
 * {@value #DAMPING_SPAN} times it (at least to {@value #LEAST_HIGHEST_DAMPING}); for each, the smallest natural frequency
 * in [wn_req / {@value #FREQUENCY_SPAN}, wn_req {@value #FREQUENCY_SPAN}] at which the corners meet the time and
 * overshoot limits, by {@value #BISECTIONS} bisections in log wn (a faster loop settles sooner on every case; where
 * a settling time jumps the bisection still ends on a frequency that meets the limits). The candidates are then
 * checked on every case in the order of their frequency: a candidate whose samples miss a limit is bisected again
 * on all cases, one that exceeds the actuator limit is dropped (a faster loop only needs more command). The
 * chosen damping ratio is then refined between its grid neighbours (golden section on the corners' frequency).
 *
 * <p>Selection rule, least bandwidth: the target with the smallest natural frequency whose every case meets the
 * limits. Its worst case sits on the binding limit, so it is the target closest to the requested spec, and it asks
 * the least command (u(0+) = kr r grows as wn^2) and the least bandwidth of the loop. The fastest target is not a
 * rule: without an actuator limit it is unbounded.
 *
 * <p>Every loop is capped: the candidates, the bisections, the target evaluations ({@value #MAX_EVALUATIONS}) and
 * the case evaluations ({@value #MAX_CASE_EVALUATIONS}). One instance serves one search (it counts them).
 */
public final class RobustTargetSearch {

    /** Damping ratios tried. */
    public static final int DAMPING_CANDIDATES = 12;
    /** The damping grid reaches this multiple of the requested damping ratio... */
    static final double DAMPING_SPAN = 2.5;
    /** ...and at least this damping ratio. */
    static final double LEAST_HIGHEST_DAMPING = 1.6;
    /** The natural frequency is searched within this factor of the requested one, both ways. */
    public static final double FREQUENCY_SPAN = 16;
    /** Bisections in log wn: the bracket of 256 shrinks to 256^(2^-18), a relative width of 2e-5. */
    static final int BISECTIONS = 18;
    /** Golden-section steps refining the chosen damping ratio between its grid neighbours. */
    static final int REFINEMENTS = 10;
    /** Cap on target evaluations (each over the corners or over every case). */
    public static final int MAX_EVALUATIONS = 1000;
    /** Cap on closed-form step metrics per search: about 1 s of CPU at 4 us each. */
    public static final long MAX_CASE_EVALUATIONS = 250_000;

    private final AcceptanceLimits limits;
    private final Double actuatorLimit;
    private final double stepSize;
    private final CanonicalPlant nominal;
    private final List<CanonicalPlant> corners;
    private final List<CanonicalPlant> everyCase;
    private int evaluations;
    private long caseEvaluations;

    /**
     * @param nominal       the plant the gains are designed for
     * @param box           the parameter box
     * @param samples       Monte Carlo samples (0 to {@value UncertaintyAnalyzer#MAX_SAMPLES})
     * @param seed          their seed (the samples of {@link ParameterSampler}, as the uncertainty check draws them)
     * @param limits        the limits every case must meet (settling or rise time, overshoot)
     * @param actuatorLimit the bound on max |u| of every case, or null
     * @param stepSize      reference step r
     */
    public RobustTargetSearch(
            CanonicalPlant nominal,
            ParameterBox box,
            int samples,
            long seed,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double stepSize) {
        if (samples < 0 || samples > UncertaintyAnalyzer.MAX_SAMPLES) {
            throw new IllegalArgumentException("samples must be 0 to " + UncertaintyAnalyzer.MAX_SAMPLES);
        }
        this.nominal = nominal;
        this.limits = limits;
        this.actuatorLimit = actuatorLimit;
        this.stepSize = stepSize;
        this.corners = box.corners();
        List<CanonicalPlant> all = new ArrayList<>(corners);
        ParameterSampler sampler = new ParameterSampler(box, seed);
        for (int s = 0; s < samples; s++) {
            all.add(ParameterBox.plant(sampler.next()));
        }
        this.everyCase = List.copyOf(all);
    }

    /** The gains of the pole-matched design of {@code target} on the nominal plant. */
    public static FeedbackGains gains(CanonicalPlant nominal, TargetDynamics target) {
        double zeta = target.dampingRatio();
        double wn = target.naturalFrequencyRadPerSec();
        return new FeedbackGains(
                (wn * wn - nominal.a0()) / nominal.b(),
                (2 * zeta * wn - nominal.a1()) / nominal.b(),
                wn * wn / nominal.b());
    }

    /**
     * @param requested  the target of the requested spec (the grid's start)
     * @param designable whether the closed-form design exists for a target (pole match and gamma bounds)
     * @return the chosen target, or the best spec the box allows when none meets the limits
     */
    public Outcome search(TargetDynamics requested, Predicate<TargetDynamics> designable) {
        double zetaRequested = requested.dampingRatio();
        double wnRequested = requested.naturalFrequencyRadPerSec();
        double zetaHighest = Math.max(DAMPING_SPAN * zetaRequested, LEAST_HIGHEST_DAMPING);
        double lowest = wnRequested / FREQUENCY_SPAN;
        double highest = wnRequested * FREQUENCY_SPAN;
        List<TargetDynamics> candidates = new ArrayList<>();
        for (int k = 0; k < DAMPING_CANDIDATES; k++) {
            Cancellation.checkpoint();
            double zeta = zetaRequested * Math.pow(zetaHighest / zetaRequested, k / (DAMPING_CANDIDATES - 1.0));
            if (!meetsSpec(zeta, highest, corners)) {
                continue; // no frequency in range brings the corners inside the limits at this damping
            }
            candidates.add(new TargetDynamics(zeta, smallestMeeting(zeta, lowest, highest, corners)));
        }
        candidates.sort(Comparator.comparingDouble(TargetDynamics::naturalFrequencyRadPerSec));
        TargetDynamics best = null;
        for (TargetDynamics candidate : candidates) {
            Cancellation.checkpoint();
            if (best != null && candidate.naturalFrequencyRadPerSec() >= best.naturalFrequencyRadPerSec()) {
                break; // every case needs at least the corners' frequency: no later candidate is slower
            }
            TargetDynamics full = candidate;
            if (!meetsSpec(candidate.dampingRatio(), candidate.naturalFrequencyRadPerSec(), everyCase)) {
                if (!meetsSpec(candidate.dampingRatio(), highest, everyCase)) {
                    continue;
                }
                full = new TargetDynamics(
                        candidate.dampingRatio(),
                        smallestMeeting(
                                candidate.dampingRatio(), candidate.naturalFrequencyRadPerSec(), highest, everyCase));
            }
            if (!withinActuator(full.dampingRatio(), full.naturalFrequencyRadPerSec()) || !designable.test(full)) {
                continue;
            }
            if (best == null || full.naturalFrequencyRadPerSec() < best.naturalFrequencyRadPerSec()) {
                best = full;
            }
        }
        if (best != null) {
            best = refined(best, zetaRequested, zetaHighest, lowest, highest, designable);
            return new Outcome(best, null, null, evaluations, caseEvaluations, everyCase.size());
        }
        return bestAllowed(zetaRequested, zetaHighest, lowest, highest);
    }

    /**
     * The damping grid is coarse (a step of (zetaHighest / zetaRequested)^(1/11)): between the chosen damping
     * ratio's neighbours, a golden-section search of {@value #REFINEMENTS} steps on the corners' smallest meeting
     * frequency (infinite where the corners cannot be met), then the same checks on every case. The refined target
     * replaces the grid's only if it passes them with a smaller natural frequency.
     */
    private TargetDynamics refined(
            TargetDynamics best,
            double zetaRequested,
            double zetaHighest,
            double lowest,
            double highest,
            Predicate<TargetDynamics> designable) {
        double step = Math.pow(zetaHighest / zetaRequested, 1 / (DAMPING_CANDIDATES - 1.0));
        double lo = Math.max(zetaRequested, best.dampingRatio() / step);
        double hi = Math.min(zetaHighest, best.dampingRatio() * step);
        double golden = (Math.sqrt(5) - 1) / 2;
        double x1 = hi - golden * (hi - lo);
        double x2 = lo + golden * (hi - lo);
        double f1 = cornerFrequency(x1, lowest, highest);
        double f2 = cornerFrequency(x2, lowest, highest);
        for (int i = 0; i < REFINEMENTS; i++) {
            Cancellation.checkpoint();
            if (f1 <= f2) {
                hi = x2;
                x2 = x1;
                f2 = f1;
                x1 = hi - golden * (hi - lo);
                f1 = cornerFrequency(x1, lowest, highest);
            } else {
                lo = x1;
                x1 = x2;
                f1 = f2;
                x2 = lo + golden * (hi - lo);
                f2 = cornerFrequency(x2, lowest, highest);
            }
        }
        double zeta = f1 <= f2 ? x1 : x2;
        double wn = Math.min(f1, f2);
        if (!(wn < best.naturalFrequencyRadPerSec())) {
            return best;
        }
        if (!meetsSpec(zeta, wn, everyCase)) {
            if (!meetsSpec(zeta, best.naturalFrequencyRadPerSec(), everyCase)) {
                return best;
            }
            wn = smallestMeeting(zeta, wn, best.naturalFrequencyRadPerSec(), everyCase);
        }
        TargetDynamics candidate = new TargetDynamics(zeta, wn);
        boolean better =
                wn < best.naturalFrequencyRadPerSec() && withinActuator(zeta, wn) && designable.test(candidate);
        return better ? candidate : best;
    }

    /** The corners' smallest meeting frequency at this damping, or infinity when none in range meets them. */
    private double cornerFrequency(double zeta, double lowest, double highest) {
        return meetsSpec(zeta, highest, corners)
                ? smallestMeeting(zeta, lowest, highest, corners)
                : Double.POSITIVE_INFINITY;
    }

    /**
     * No target meets the limits: the best spec the box allows, with the overshoot kept, is the shortest worst-case
     * time (settling or rise) over the damping grid at the fastest frequency the actuator allows; if the overshoot
     * cannot be kept at any damping, the smallest worst-case overshoot at the fastest frequency tried.
     */
    private Outcome bestAllowed(double zetaRequested, double zetaHighest, double lowest, double highest) {
        double bestTime = Double.POSITIVE_INFINITY;
        double bestOvershoot = Double.POSITIVE_INFINITY;
        for (int k = 0; k < DAMPING_CANDIDATES; k++) {
            Cancellation.checkpoint();
            double zeta = zetaRequested * Math.pow(zetaHighest / zetaRequested, k / (DAMPING_CANDIDATES - 1.0));
            double wn = highest;
            if (actuatorLimit != null && !withinActuator(zeta, highest)) {
                if (!withinActuator(zeta, lowest)) {
                    continue;
                }
                wn = largestWithinActuator(zeta, lowest, highest);
            }
            double[] worst = worstMetrics(zeta, wn);
            if (limits.overshootPercent() == null || worst[1] <= limits.overshootPercent()) {
                bestTime = Math.min(bestTime, worst[0]);
            }
            bestOvershoot = Math.min(bestOvershoot, worst[1]);
        }
        Double time = Double.isFinite(bestTime) ? bestTime : null;
        Double overshoot = time == null && Double.isFinite(bestOvershoot) ? bestOvershoot : null;
        return new Outcome(null, time, overshoot, evaluations, caseEvaluations, everyCase.size());
    }

    /** The smallest wn in (lo, hi] meeting the spec on the cases, given that hi meets it. */
    private double smallestMeeting(double zeta, double lo, double hi, List<CanonicalPlant> cases) {
        if (meetsSpec(zeta, lo, cases)) {
            return lo;
        }
        return GeometricBisection.lowestTrue(lo, hi, BISECTIONS, wn -> meetsSpec(zeta, wn, cases));
    }

    /** The largest wn in [lo, hi) within the actuator limit on every case, given that lo is. */
    private double largestWithinActuator(double zeta, double lo, double hi) {
        return GeometricBisection.highestTrue(lo, hi, BISECTIONS, wn -> withinActuator(zeta, wn));
    }

    /** Every case stable, measurable and inside the time and overshoot limits (stops at the first miss). */
    private boolean meetsSpec(double zeta, double wn, List<CanonicalPlant> cases) {
        FeedbackGains gains = count(zeta, wn);
        for (CanonicalPlant plant : cases) {
            StepMetrics m = metrics(plant, gains);
            if (m == null || !limits.met(m.settlingTimeSeconds(), m.riseTimeSeconds(), m.overshootPercent())) {
                return false;
            }
        }
        return true;
    }

    /** max |u| within the actuator limit on every case (true without a limit). */
    private boolean withinActuator(double zeta, double wn) {
        if (actuatorLimit == null) {
            return true;
        }
        FeedbackGains gains = count(zeta, wn);
        for (CanonicalPlant plant : everyCase) {
            StepMetrics m = metrics(plant, gains);
            if (m == null || m.peakControl() > actuatorLimit) {
                return false;
            }
        }
        return true;
    }

    /** {worst time metric (settling, else rise), worst overshoot} over every case; infinite if one fails. */
    private double[] worstMetrics(double zeta, double wn) {
        FeedbackGains gains = count(zeta, wn);
        double[] worst = {0, 0};
        for (CanonicalPlant plant : everyCase) {
            StepMetrics m = metrics(plant, gains);
            if (m == null) {
                Arrays.fill(worst, Double.POSITIVE_INFINITY);
                return worst;
            }
            double time = limits.riseTimeSeconds() != null ? m.riseTimeSeconds() : m.settlingTimeSeconds();
            worst[0] = Math.max(worst[0], time);
            worst[1] = Math.max(worst[1], m.overshootPercent());
        }
        return worst;
    }

    private FeedbackGains count(double zeta, double wn) {
        if (++evaluations > MAX_EVALUATIONS) {
            throw new SearchCapException(
                    "the robust target search reached its cap of " + MAX_EVALUATIONS + " target evaluations");
        }
        return gains(nominal, new TargetDynamics(zeta, wn));
    }

    /** The closed-form metrics of one case, or null when the loop is unstable or not measurable. */
    private StepMetrics metrics(CanonicalPlant plant, FeedbackGains gains) {
        if (++caseEvaluations > MAX_CASE_EVALUATIONS) {
            throw new SearchCapException("the robust target search reached its cap of " + MAX_CASE_EVALUATIONS
                    + " closed-form case evaluations; use fewer Monte Carlo samples");
        }
        if (!LoopMatrices.stable(plant, gains)) {
            return null;
        }
        try {
            return TwoStateStepMetrics.measure(plant, gains, stepSize, limits.bandFraction());
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    /**
     * @param target               the chosen nominal target, or null when none meets the limits
     * @param proposedTimeSeconds  when none does: the shortest worst-case time (settling or rise, as judged) the
     *                             box allows with the overshoot kept, or null
     * @param proposedOvershootPercent when no time can be kept with the overshoot: the smallest worst-case
     *                             overshoot, or null
     * @param evaluations          targets evaluated (each over the corners or over every case)
     * @param caseEvaluations      closed-form step metrics computed
     * @param caseCount            corners plus samples
     */
    public record Outcome(
            TargetDynamics target,
            Double proposedTimeSeconds,
            Double proposedOvershootPercent,
            int evaluations,
            long caseEvaluations,
            int caseCount) {}

    /** The search reached one of its evaluation caps. */
    public static final class SearchCapException extends RuntimeException {
        public SearchCapException(String message) {
            super(message);
        }
    }
}
