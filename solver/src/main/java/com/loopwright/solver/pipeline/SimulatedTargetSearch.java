package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.numeric.GeometricBisection;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.spec.TargetDynamics;

/**
 * The robust target search for a loop judged by simulation, case by case (no closed form over the box): the loop
 * with integral action or an observer, a sampled loop, a loop of order n. What a design is and how one case is
 * judged is the {@link CaseJudge}'s; the cases are numbered, the corners first.
 *
 * <p>Search: {@value #DAMPING_CANDIDATES} damping ratios on a geometric grid from the requested one to
 * max(2.5 zeta, 1.6); for each, the smallest natural frequency in [wn_req / 16, 16 wn_req] at which the corners
 * meet the limits, by {@value #BISECTIONS} bisections in log wn (a relative width of 256^(2^-10), about 0.5%); then
 * every case at that frequency, bisected again on every case when a sample misses; a target whose cases exceed the
 * actuator limit is dropped. Selection rule, as the two-state search: least bandwidth. A judge whose designs exist
 * only below a natural frequency (a sampled law needs wn T &lt;= 0.5) gives that ceiling: the bracket then ends there,
 * and its top is the highest of a short ladder of frequencies below the ceiling at which the corners meet (a sampled
 * loop too fast for its period fails where a slower one meets).
 * The time limit judged is the settling time, or the rise time when the limits have no settling time (the judge's
 * horizon must then come from the loop's poles, not from a settling limit). When no target meets the limits, the
 * proposal is measured at the fastest frequency the actuator allows, searched down to the slowest frequency that
 * has a design (a loop of order n has none below some frequency).
 *
 * <p>Capped: {@value #MAX_EVALUATIONS} target designs, {@value #MAX_SIMULATED_CASES} simulated cases. One instance
 * serves one search (it counts them).
 *
 * @param <D> the design at one target (gains, observer, sampled law...)
 */
final class SimulatedTargetSearch<D> {

    /** Damping ratios tried. */
    static final int DAMPING_CANDIDATES = 4;
    /** Bisections in log wn over the bracket of 256. */
    static final int BISECTIONS = 10;
    /** Cap on target designs per search. */
    static final int MAX_EVALUATIONS = 150;
    /** Cap on simulated cases per search. */
    static final long MAX_SIMULATED_CASES = 8_000;

    /** Under a frequency ceiling, the bracket's top is tried at the highest frequency and this many below it... */
    static final int LADDER_STEPS = 4;
    /** ...each this factor below the previous. */
    static final double LADDER_FACTOR = 4;

    /** A proposed settling time is lengthened by this fraction (the bisection's width is about 0.5%). */
    static final double PROPOSAL_ROOM = 0.02;

    /** How a candidate target is designed and one case of the box judged. */
    interface CaseJudge<D> {

        /** The design at the target (on the nominal plant), or null when none exists there. */
        D designAt(TargetDynamics target);

        /** The step metrics of case {@code index} with the design, or null when unstable or not measurable. */
        StepMetrics metrics(D design, int index);
    }

    private final CaseJudge<D> judge;
    private final int cornerCount;
    private final int caseCount;
    private final AcceptanceLimits limits;
    private final Double actuatorLimit;
    private final double frequencyCeiling;
    private final double extraDamping;
    private int evaluations;
    private long simulated;

    /**
     * @param cornerCount   cases 0 .. cornerCount - 1 are the corners
     * @param caseCount     corners and samples
     * @param actuatorLimit bound on every case's max |u|, or null
     */
    SimulatedTargetSearch(
            CaseJudge<D> judge, int cornerCount, int caseCount, AcceptanceLimits limits, Double actuatorLimit) {
        this(judge, cornerCount, caseCount, limits, actuatorLimit, Double.POSITIVE_INFINITY, Double.NaN);
    }

    /**
     * @param frequencyCeiling the largest natural frequency at which the judge designs [rad/s] (infinite: none);
     *                         the search's bracket ends there
     * @param extraDamping     a damping ratio tried after the grid's (a target known to be good elsewhere, such as
     *                         the continuous robust design's), or NaN
     */
    SimulatedTargetSearch(
            CaseJudge<D> judge,
            int cornerCount,
            int caseCount,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double frequencyCeiling,
            double extraDamping) {
        if (!Double.isNaN(extraDamping) && !(extraDamping > 0 && Double.isFinite(extraDamping))) {
            throw new IllegalArgumentException("the extra damping ratio must be positive and finite, or NaN");
        }
        this.extraDamping = extraDamping;
        if (limits.settlingTimeSeconds() == null && limits.riseTimeSeconds() == null) {
            throw new IllegalArgumentException("a simulated loop is judged against a settling-time or rise-time limit");
        }
        if (!(frequencyCeiling > 0)) {
            throw new IllegalArgumentException("the frequency ceiling must be positive");
        }
        this.frequencyCeiling = frequencyCeiling;
        if (cornerCount < 1 || caseCount < cornerCount) {
            throw new IllegalArgumentException("at least one corner, and the corners among the cases");
        }
        this.judge = judge;
        this.cornerCount = cornerCount;
        this.caseCount = caseCount;
        this.limits = limits;
        this.actuatorLimit = actuatorLimit;
    }

    RobustTargetSearch.Outcome search(TargetDynamics requested) {
        double zetaRequested = requested.dampingRatio();
        double zetaHighest = Math.max(2.5 * zetaRequested, 1.6);
        double lowest = requested.naturalFrequencyRadPerSec() / RobustTargetSearch.FREQUENCY_SPAN;
        double highest =
                Math.min(requested.naturalFrequencyRadPerSec() * RobustTargetSearch.FREQUENCY_SPAN, frequencyCeiling);
        if (!(highest > lowest)) {
            return new RobustTargetSearch.Outcome(null, null, null, evaluations, simulated, caseCount);
        }
        TargetDynamics best = null;
        for (int k = 0; k < dampingCount(); k++) {
            Cancellation.checkpoint();
            double zeta = zeta(zetaRequested, zetaHighest, k);
            double top = top(zeta, lowest, highest);
            if (Double.isNaN(top)) {
                continue;
            }
            double wn = smallestMeeting(zeta, lowest, top, cornerCount);
            if (best != null && wn >= best.naturalFrequencyRadPerSec()) {
                continue; // every case needs at least the corners' frequency
            }
            if (!meets(zeta, wn, caseCount)) {
                if (!meets(zeta, top, caseCount)) {
                    continue;
                }
                wn = smallestMeeting(zeta, wn, top, caseCount);
            }
            if ((best == null || wn < best.naturalFrequencyRadPerSec()) && withinActuator(zeta, wn)) {
                best = new TargetDynamics(zeta, wn);
            }
        }
        if (best != null) {
            return new RobustTargetSearch.Outcome(best, null, null, evaluations, simulated, caseCount);
        }
        return bestAllowed(zetaRequested, zetaHighest, lowest, highest);
    }

    /**
     * No target meets the limits: the shortest worst-case time (settling, else rise) over the damping grid with the
     * overshoot kept, at the fastest frequency the actuator allows; else the smallest worst-case overshoot.
     */
    private RobustTargetSearch.Outcome bestAllowed(
            double zetaRequested, double zetaHighest, double lowest, double highest) {
        double bestTime = Double.POSITIVE_INFINITY;
        double bestOvershoot = Double.POSITIVE_INFINITY;
        for (int k = 0; k < dampingCount(); k++) {
            Cancellation.checkpoint();
            double zeta = zeta(zetaRequested, zetaHighest, k);
            for (int step = 0; step < ladderSteps(); step++) {
                double fastest = highest / Math.pow(LADDER_FACTOR, step);
                if (fastest < lowest) {
                    break;
                }
                double wn = fastest;
                if (actuatorLimit != null && !withinActuator(zeta, fastest)) {
                    double floor = lowest;
                    if (!withinActuator(zeta, floor)) {
                        // a loop of order n has no design below some frequency: start from the slowest that has one
                        floor = designAt(zeta, floor) == null ? slowestDesignable(zeta, lowest, fastest) : Double.NaN;
                        if (!(floor < fastest) || !withinActuator(zeta, floor)) {
                            continue;
                        }
                    }
                    wn = largestWithinActuator(zeta, floor, fastest);
                }
                double[] worst = worstMetrics(zeta, wn);
                if (limits.overshootPercent() == null || worst[1] <= limits.overshootPercent()) {
                    bestTime = Math.min(bestTime, worst[0]);
                }
                bestOvershoot = Math.min(bestOvershoot, worst[1]);
            }
        }
        // the room covers the bisection's width (about 0.5% in wn, so in the settling time) when it is sent back
        Double time = Double.isFinite(bestTime) ? bestTime * (1 + PROPOSAL_ROOM) : null;
        Double overshoot = time == null && Double.isFinite(bestOvershoot) ? bestOvershoot : null;
        return new RobustTargetSearch.Outcome(null, time, overshoot, evaluations, simulated, caseCount);
    }

    /**
     * The top of the bracket at this damping: the highest frequency at which the corners meet the limits, or NaN.
     * Without a frequency ceiling a faster loop settles sooner on every case, so only the highest is tried. Under
     * a ceiling (a sampled loop) the fastest loop may fail by sampling while a slower one meets: the frequencies
     * highest / {@value #LADDER_FACTOR}^j, j &lt; {@value #LADDER_STEPS}, not below the lowest, are tried in turn.
     */
    private double top(double zeta, double lowest, double highest) {
        for (int step = 0; step < ladderSteps(); step++) {
            double wn = highest / Math.pow(LADDER_FACTOR, step);
            if (wn < lowest) {
                return Double.NaN;
            }
            if (meets(zeta, wn, cornerCount)) {
                return wn;
            }
        }
        return Double.NaN;
    }

    private int ladderSteps() {
        return Double.isInfinite(frequencyCeiling) ? 1 : LADDER_STEPS;
    }

    private int dampingCount() {
        return DAMPING_CANDIDATES + (Double.isNaN(extraDamping) ? 0 : 1);
    }

    private double zeta(double zetaRequested, double zetaHighest, int k) {
        if (k == DAMPING_CANDIDATES) {
            return extraDamping;
        }
        return zetaRequested * Math.pow(zetaHighest / zetaRequested, k / (DAMPING_CANDIDATES - 1.0));
    }

    private double smallestMeeting(double zeta, double lo, double hi, int cases) {
        if (meets(zeta, lo, cases)) {
            return lo;
        }
        return GeometricBisection.lowestTrue(lo, hi, BISECTIONS, wn -> meets(zeta, wn, cases));
    }

    /**
     * The slowest frequency in (lo, hi] with a design, by {@value #BISECTIONS} bisections in log wn (the design is
     * taken to exist above some frequency); NaN when there is none at hi.
     */
    private double slowestDesignable(double zeta, double lo, double hi) {
        if (designAt(zeta, hi) == null) {
            return Double.NaN;
        }
        return GeometricBisection.lowestTrue(lo, hi, BISECTIONS, wn -> designAt(zeta, wn) != null);
    }

    private double largestWithinActuator(double zeta, double lo, double hi) {
        return GeometricBisection.highestTrue(lo, hi, BISECTIONS, wn -> withinActuator(zeta, wn));
    }

    /** Designable, and the first {@code cases} cases stable, measured and inside the limits (stops at a miss). */
    private boolean meets(double zeta, double wn, int cases) {
        D design = designAt(zeta, wn);
        if (design == null) {
            return false;
        }
        for (int i = 0; i < cases; i++) {
            StepMetrics m = counted(design, i);
            if (m == null || !limits.met(m.settlingTimeSeconds(), m.riseTimeSeconds(), m.overshootPercent())) {
                return false;
            }
        }
        return true;
    }

    private boolean withinActuator(double zeta, double wn) {
        if (actuatorLimit == null) {
            return true;
        }
        D design = designAt(zeta, wn);
        if (design == null) {
            return false;
        }
        for (int i = 0; i < caseCount; i++) {
            StepMetrics m = counted(design, i);
            if (m == null || m.peakControl() > actuatorLimit) {
                return false;
            }
        }
        return true;
    }

    /** {worst time (settling, else rise), worst overshoot} over every case; infinite when one fails or no design. */
    private double[] worstMetrics(double zeta, double wn) {
        double[] failed = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
        D design = designAt(zeta, wn);
        if (design == null) {
            return failed;
        }
        double[] worst = {0, 0};
        for (int i = 0; i < caseCount; i++) {
            StepMetrics m = counted(design, i);
            if (m == null) {
                return failed;
            }
            double time = limits.settlingTimeSeconds() != null ? m.settlingTimeSeconds() : m.riseTimeSeconds();
            worst[0] = Math.max(worst[0], time);
            worst[1] = Math.max(worst[1], m.overshootPercent());
        }
        return worst;
    }

    /** The judge's design, counted against the cap of target designs. */
    private D designAt(double zeta, double wn) {
        if (++evaluations > MAX_EVALUATIONS) {
            throw new RobustTargetSearch.SearchCapException(
                    "the robust loop search reached its cap of " + MAX_EVALUATIONS + " loop designs");
        }
        return judge.designAt(new TargetDynamics(zeta, wn));
    }

    /** The judge's metrics of one case, counted against the cap of simulated cases. */
    private StepMetrics counted(D design, int index) {
        if (++simulated > MAX_SIMULATED_CASES) {
            throw new RobustTargetSearch.SearchCapException("the robust loop search reached its cap of "
                    + MAX_SIMULATED_CASES + " simulated cases; use fewer Monte Carlo samples");
        }
        Cancellation.checkpoint();
        return judge.metrics(design, index);
    }
}
