package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.highorder.PoleMatchedRiccati;
import com.loopwright.solver.integral.IntegralAugmentation;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.observer.LoopSystem;
import com.loopwright.solver.observer.OutputFeedbackLoop;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.riccati.NoStabilizingSolutionException;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.ParameterSampler;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;

/**
 * The robust target search for the loop with integral action and/or position-only sensing. There is no closed form
 * for these loops over the box: for each candidate target the loop is designed on the nominal plant (the same
 * machinery as {@link RealLoopPipeline}), and each case of the box is judged by the exact zero-order-hold step of
 * the perturbed loop (the plant perturbed, the law and observer as designed; {@link OutputFeedbackLoop#closedOn}).
 *
 * <p>Search, coarser than the two-state search because every case is a simulation: {@value #DAMPING_CANDIDATES}
 * damping ratios on a geometric grid from the requested one to max(2.5 zeta, 1.6); for each, the smallest natural
 * frequency in [wn_req / 16, 16 wn_req] at which the corners meet the limits, by {@value #BISECTIONS} bisections
 * in log wn (a relative width of 256^(2^-10), about 0.5%); then every case at that frequency, bisected again on
 * every case when a sample misses; a target whose cases exceed the actuator limit is dropped. Selection rule, as
 * the two-state search: least bandwidth.
 *
 * <p>Capped: {@value #MAX_EVALUATIONS} target designs, {@value #MAX_SIMULATED_CASES} simulated cases. One instance
 * serves one search (it counts them).
 */
final class RobustLoopSearch {

    /** Damping ratios tried. */
    static final int DAMPING_CANDIDATES = 4;
    /** Bisections in log wn over the bracket of 256. */
    static final int BISECTIONS = 10;
    /** Cap on target designs per search. */
    static final int MAX_EVALUATIONS = 150;
    /** Cap on simulated cases per search. */
    static final long MAX_SIMULATED_CASES = 8_000;

    /** A proposed settling time is lengthened by this fraction (the bisection's width is about 0.5%). */
    static final double PROPOSAL_ROOM = 0.02;

    private final RealLoopPipeline loops;
    private final RealLoopPipeline.Request request;
    private final CanonicalPlant nominal;
    private final AcceptanceLimits limits;
    private final Double actuatorLimit;
    private final double stepSize;
    private final List<CanonicalPlant> corners;
    private final List<CanonicalPlant> everyCase;
    private final HInfinityNormCalculator norms = new HInfinityNormCalculator();
    private int evaluations;
    private long simulated;

    RobustLoopSearch(
            RealLoopPipeline loops,
            RealLoopPipeline.Request request,
            CanonicalPlant nominal,
            ParameterBox box,
            int samples,
            long seed,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double stepSize) {
        if (limits.settlingTimeSeconds() == null) {
            throw new IllegalArgumentException("the loop is judged against a settling-time limit");
        }
        this.loops = loops;
        this.request = request;
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

    List<CanonicalPlant> corners() {
        return corners;
    }

    List<CanonicalPlant> everyCase() {
        return everyCase;
    }

    RobustTargetSearch.Outcome search(TargetDynamics requested) {
        double zetaRequested = requested.dampingRatio();
        double zetaHighest = Math.max(2.5 * zetaRequested, 1.6);
        double lowest = requested.naturalFrequencyRadPerSec() / RobustTargetSearch.FREQUENCY_SPAN;
        double highest = requested.naturalFrequencyRadPerSec() * RobustTargetSearch.FREQUENCY_SPAN;
        TargetDynamics best = null;
        for (int k = 0; k < DAMPING_CANDIDATES; k++) {
            Cancellation.checkpoint();
            double zeta = zeta(zetaRequested, zetaHighest, k);
            if (!meets(zeta, highest, corners)) {
                continue;
            }
            double wn = smallestMeeting(zeta, lowest, highest, corners);
            if (best != null && wn >= best.naturalFrequencyRadPerSec()) {
                continue; // every case needs at least the corners' frequency
            }
            if (!meets(zeta, wn, everyCase)) {
                if (!meets(zeta, highest, everyCase)) {
                    continue;
                }
                wn = smallestMeeting(zeta, wn, highest, everyCase);
            }
            if ((best == null || wn < best.naturalFrequencyRadPerSec()) && withinActuator(zeta, wn)) {
                best = new TargetDynamics(zeta, wn);
            }
        }
        if (best != null) {
            return new RobustTargetSearch.Outcome(best, null, null, evaluations, simulated, everyCase.size());
        }
        return bestAllowed(zetaRequested, zetaHighest, lowest, highest);
    }

    /**
     * No target meets the limits: the shortest worst-case settling time over the damping grid with the overshoot
     * kept, at the fastest frequency the actuator allows; else the smallest worst-case overshoot.
     */
    private RobustTargetSearch.Outcome bestAllowed(
            double zetaRequested, double zetaHighest, double lowest, double highest) {
        double bestTime = Double.POSITIVE_INFINITY;
        double bestOvershoot = Double.POSITIVE_INFINITY;
        for (int k = 0; k < DAMPING_CANDIDATES; k++) {
            Cancellation.checkpoint();
            double zeta = zeta(zetaRequested, zetaHighest, k);
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
        // the room covers the bisection's width (about 0.5% in wn, so in the settling time) when it is sent back
        Double time = Double.isFinite(bestTime) ? bestTime * (1 + PROPOSAL_ROOM) : null;
        Double overshoot = time == null && Double.isFinite(bestOvershoot) ? bestOvershoot : null;
        return new RobustTargetSearch.Outcome(null, time, overshoot, evaluations, simulated, everyCase.size());
    }

    private static double zeta(double zetaRequested, double zetaHighest, int k) {
        return zetaRequested * Math.pow(zetaHighest / zetaRequested, k / (DAMPING_CANDIDATES - 1.0));
    }

    private double smallestMeeting(double zeta, double lo, double hi, List<CanonicalPlant> cases) {
        if (meets(zeta, lo, cases)) {
            return lo;
        }
        for (int i = 0; i < BISECTIONS; i++) {
            double mid = Math.sqrt(lo * hi);
            if (meets(zeta, mid, cases)) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }

    private double largestWithinActuator(double zeta, double lo, double hi) {
        for (int i = 0; i < BISECTIONS; i++) {
            double mid = Math.sqrt(lo * hi);
            if (withinActuator(zeta, mid)) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** Designable, and every case stable, measured and inside the limits (stops at the first miss). */
    private boolean meets(double zeta, double wn, List<CanonicalPlant> cases) {
        RealLoopPipeline.LoopParts parts = parts(zeta, wn);
        if (parts == null) {
            return false;
        }
        for (CanonicalPlant plant : cases) {
            StepMetrics m = counted(parts, plant);
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
        RealLoopPipeline.LoopParts parts = parts(zeta, wn);
        if (parts == null) {
            return false;
        }
        for (CanonicalPlant plant : everyCase) {
            StepMetrics m = counted(parts, plant);
            if (m == null || m.peakControl() > actuatorLimit) {
                return false;
            }
        }
        return true;
    }

    /** {worst settling time, worst overshoot} over every case; infinite when one fails or no design exists. */
    private double[] worstMetrics(double zeta, double wn) {
        RealLoopPipeline.LoopParts parts = parts(zeta, wn);
        double[] worst = {0, 0};
        for (CanonicalPlant plant : parts == null ? List.<CanonicalPlant>of() : everyCase) {
            StepMetrics m = counted(parts, plant);
            if (m == null) {
                return new double[] {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
            }
            worst[0] = Math.max(worst[0], m.settlingTimeSeconds());
            worst[1] = Math.max(worst[1], m.overshootPercent());
        }
        return parts == null ? new double[] {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY} : worst;
    }

    /** The loop designed on the nominal plant for the target, or null when no design exists there. */
    private RealLoopPipeline.LoopParts parts(double zeta, double wn) {
        if (++evaluations > MAX_EVALUATIONS) {
            throw new RobustTargetSearch.SearchCapException(
                    "the robust loop search reached its cap of " + MAX_EVALUATIONS + " loop designs");
        }
        try {
            return loops.partsAt(request, new TargetDynamics(zeta, wn));
        } catch (InfeasibleDesignException
                | PoleMatchedRiccati.SystemFailure
                | NoStabilizingSolutionException
                | IllegalArgumentException e) {
            return null;
        }
    }

    /**
     * The exact zero-order-hold step metrics of the designed loop on one case (step of size r), or null when the
     * perturbed loop is unstable or its step is not measurable.
     */
    StepMetrics metrics(RealLoopPipeline.LoopParts parts, CanonicalPlant plant) {
        Cancellation.checkpoint();
        try {
            LoopSystem loop = perturbed(parts, plant);
            double horizon = RealLoopPipeline.horizon(loop.a(), limits.settlingTimeSeconds());
            return new StepResponseMetrics()
                    .measure(
                            RealLoopPipeline.linear(loop, parts.law()),
                            stepSize,
                            horizon,
                            RealLoopPipeline.samples(loop.a(), horizon),
                            limits.bandFraction());
        } catch (IllegalArgumentException e) {
            return null; // unstable, too fast to sample, or not settled within the window
        }
    }

    /** {@link #metrics} counted against the search's cap. */
    private StepMetrics counted(RealLoopPipeline.LoopParts parts, CanonicalPlant plant) {
        if (++simulated > MAX_SIMULATED_CASES) {
            throw new RobustTargetSearch.SearchCapException("the robust loop search reached its cap of "
                    + MAX_SIMULATED_CASES + " simulated cases; use fewer Monte Carlo samples");
        }
        return metrics(parts, plant);
    }

    /**
     * One case judged for the report: its step metrics and, at a corner, the norm from w to z of the perturbed loop
     * (the disturbance column is [0, d]: the norm scales with |d| / |d_nominal|, so it is computed with the nominal
     * d and scaled).
     */
    UncertainCase judged(RealLoopPipeline.LoopParts parts, CanonicalPlant plant, boolean corner) {
        StepMetrics m = metrics(parts, plant);
        Double gain = null;
        if (corner && m != null) {
            try {
                LoopSystem loop = perturbed(parts, plant);
                gain = Math.abs(plant.d() / nominal.d())
                        * norms.compute(loop.a(), loop.disturbance(), loop.performance())
                                .value();
            } catch (RuntimeException e) {
                gain = null;
            }
        }
        if (m == null) {
            return new UncertainCase(plant, corner, false, null, null, null, null, gain, false);
        }
        boolean meets = limits.met(m.settlingTimeSeconds(), m.riseTimeSeconds(), m.overshootPercent());
        return new UncertainCase(
                plant,
                corner,
                true,
                m.settlingTimeSeconds(),
                m.riseTimeSeconds(),
                m.overshootPercent(),
                m.peakControl(),
                gain,
                meets);
    }

    /** The perturbed loop; the step does not depend on d, so the case is built with the nominal d (d may be 0). */
    private LoopSystem perturbed(RealLoopPipeline.LoopParts parts, CanonicalPlant plant) {
        CanonicalPlant actual = new CanonicalPlant(plant.a0(), plant.a1(), plant.b(), nominal.d());
        return OutputFeedbackLoop.closedOn(
                IntegralAugmentation.companionOf(actual),
                request.plant(),
                request.plant().outputRow().data,
                parts.law(),
                parts.observerGain(),
                parts.weights());
    }
}
