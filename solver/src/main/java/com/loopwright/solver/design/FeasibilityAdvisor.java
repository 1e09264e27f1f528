package com.loopwright.solver.design;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.OvershootDamping;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.function.DoublePredicate;

/**
 * Nearest specs a plant can meet, found numerically: keep the overshoot and move the natural frequency (a
 * shorter or longer time spec), or keep the time spec and move the damping ratio (another overshoot). Each
 * search walks a capped geometric or linear grid outward from the infeasible spec, inside the accepted
 * {@link SpecRanges}, then bisects the feasibility boundary and steps just inside it. A proposal is returned only
 * when the request with the proposed value (as it will be posted back) lies in the ranges and is feasible,
 * including a caller's fixed gamma; a step inside that would leave the ranges is clamped to their edge.
 */
public final class FeasibilityAdvisor {

    /** Grid ratio for the natural-frequency walk; 1.02^700 spans a factor of about 10^6 either way. */
    private static final double FREQUENCY_STEP = 1.02;

    private static final int FREQUENCY_STEPS = 700;
    /** Damping ratios walked for an overshoot proposal: (0, 1) in steps of 0.001. */
    private static final double DAMPING_STEP = 0.001;

    private static final double DAMPING_MIN = 0.02;
    private static final double DAMPING_MAX = 0.998;
    /** Step from the bisected damping boundary into the feasible side (about 0.1 percentage point of overshoot). */
    private static final double DAMPING_INSIDE = 0.002;

    private static final int BOUNDARY_BISECTIONS = 60;
    /** Relative step from the bisected boundary into the feasible side. */
    private static final double INSIDE_MARGIN = 0.01;

    private final ClosedFormDesigner designer;
    private final SpecInverter inverter = new SpecInverter();

    public FeasibilityAdvisor(ClosedFormDesigner designer) {
        this.designer = designer;
    }

    /** Proposals without range limits and with gamma chosen over its minimum. */
    public List<SpecProposal> propose(CanonicalPlant plant, DesignSpec spec) {
        return propose(
                plant,
                spec,
                new GammaChoice.MarginOverMinimum(GammaChoice.MarginOverMinimum.DEFAULT_FACTOR),
                SpecRanges.UNBOUNDED);
    }

    /**
     * Proposals for a spec whose target has an obstacle (either list element may be missing; the list is empty
     * when no single change within the ranges works).
     */
    public List<SpecProposal> propose(
            CanonicalPlant plant, DesignSpec spec, GammaChoice gammaChoice, SpecRanges ranges) {
        List<SpecProposal> proposals = new ArrayList<>(2);
        double zeta = OvershootDamping.dampingRatio(spec.overshootFraction());
        TimeSpec timeSpec = spec.timeSpec();
        double normalizedTime = timeSpec.normalizedTime(zeta);
        double wn = normalizedTime / timeSpec.seconds();
        nearestFeasibleTime(plant, spec, zeta, normalizedTime, wn, gammaChoice, ranges)
                .ifPresent(seconds -> proposals.add(new SpecProposal(
                        SpecQuantity.TIME_SPEC,
                        seconds,
                        "keeps the overshoot and moves the natural frequency just inside the feasible range")));
        nearestFeasibleOvershoot(plant, spec, zeta, gammaChoice, ranges)
                .ifPresent(percent -> proposals.add(new SpecProposal(
                        SpecQuantity.OVERSHOOT_PERCENT,
                        percent,
                        "keeps the time spec and moves the damping ratio just inside the feasible range")));
        return proposals;
    }

    private boolean feasible(CanonicalPlant plant, double zeta, double wn, GammaChoice gammaChoice) {
        if (!(wn > 0) || !Double.isFinite(wn) || !(zeta > 0 && zeta < 1)) {
            return false;
        }
        TargetDynamics target = new TargetDynamics(zeta, wn);
        if (designer.obstacle(plant, target).isPresent()) {
            return false;
        }
        if (gammaChoice instanceof GammaChoice.Fixed fixed && plant.d() != 0) {
            double gammaMin = designer.bounds(plant, PoleMatch.of(plant, target)).stream()
                    .mapToDouble(GammaBound::gammaLowerBound)
                    .max()
                    .orElse(0);
            return fixed.gamma() > gammaMin;
        }
        return true;
    }

    /** Whether the spec, as a request would state it, inverts to a feasible target. */
    private boolean feasibleAsPosted(CanonicalPlant plant, DesignSpec spec, GammaChoice gammaChoice) {
        TargetDynamics target = inverter.invert(spec).target();
        return feasible(plant, target.dampingRatio(), target.naturalFrequencyRadPerSec(), gammaChoice);
    }

    private static TimeSpec withSeconds(TimeSpec timeSpec, double seconds) {
        return timeSpec instanceof TimeSpec.SettlingTime settling
                ? new TimeSpec.SettlingTime(seconds, settling.bandFraction())
                : new TimeSpec.RiseTime(seconds);
    }

    private OptionalDouble nearestFeasibleTime(
            CanonicalPlant plant,
            DesignSpec spec,
            double zeta,
            double normalizedTime,
            double wn,
            GammaChoice gammaChoice,
            SpecRanges ranges) {
        DoublePredicate ok = w -> ranges.timeInRange(normalizedTime / w) && feasible(plant, zeta, w, gammaChoice);
        DoublePredicate accepted = seconds -> ranges.timeInRange(seconds)
                && feasibleAsPosted(
                        plant,
                        new DesignSpec(spec.overshootFraction(), withSeconds(spec.timeSpec(), seconds)),
                        gammaChoice);
        for (int step = 1; step <= FREQUENCY_STEPS; step++) {
            double factor = Math.pow(FREQUENCY_STEP, step);
            for (double candidate : new double[] {wn * factor, wn / factor}) {
                if (ok.test(candidate)) {
                    double outside = candidate > wn ? candidate / FREQUENCY_STEP : candidate * FREQUENCY_STEP;
                    double edge = boundary(ok, outside, candidate);
                    double inside = edge * (candidate > wn ? 1 + INSIDE_MARGIN : 1 - INSIDE_MARGIN);
                    return firstAccepted(
                            accepted,
                            ranges.minTimeSeconds(),
                            ranges.maxTimeSeconds(),
                            normalizedTime / inside,
                            normalizedTime / candidate,
                            normalizedTime / edge);
                }
            }
        }
        return OptionalDouble.empty();
    }

    private OptionalDouble nearestFeasibleOvershoot(
            CanonicalPlant plant, DesignSpec spec, double zeta, GammaChoice gammaChoice, SpecRanges ranges) {
        TimeSpec timeSpec = spec.timeSpec();
        // overshoot falls as zeta rises: the range's largest overshoot bounds zeta from below
        double zetaLow = Math.max(
                DAMPING_MIN,
                ranges.maxOvershootPercent() >= 100
                        ? 0
                        : OvershootDamping.dampingRatio(ranges.maxOvershootPercent() / 100));
        double zetaHigh = Math.min(DAMPING_MAX, OvershootDamping.dampingRatio(ranges.minOvershootPercent() / 100));
        DoublePredicate ok = z -> feasible(plant, z, timeSpec.normalizedTime(z) / timeSpec.seconds(), gammaChoice);
        DoublePredicate accepted = percent -> ranges.overshootInRange(percent)
                && percent > 0
                && feasibleAsPosted(plant, spec.withOvershoot(percent / 100), gammaChoice);
        int steps = (int) Math.ceil((DAMPING_MAX - DAMPING_MIN) / DAMPING_STEP);
        for (int step = 1; step <= steps; step++) {
            for (double candidate : new double[] {zeta + step * DAMPING_STEP, zeta - step * DAMPING_STEP}) {
                if (candidate >= zetaLow && candidate <= zetaHigh && ok.test(candidate)) {
                    double outside = candidate > zeta ? candidate - DAMPING_STEP : candidate + DAMPING_STEP;
                    double edge = boundary(ok, outside, candidate);
                    double inside = SpecRanges.clamp(
                            edge + (candidate > zeta ? DAMPING_INSIDE : -DAMPING_INSIDE), zetaLow, zetaHigh);
                    return firstAccepted(
                            accepted,
                            ranges.minOvershootPercent(),
                            ranges.maxOvershootPercent(),
                            100 * OvershootDamping.overshoot(inside),
                            100 * OvershootDamping.overshoot(candidate),
                            100 * OvershootDamping.overshoot(edge));
                }
            }
        }
        return OptionalDouble.empty();
    }

    /** The first value, moved into [low, high], that the request accepts as posted back. */
    private static OptionalDouble firstAccepted(DoublePredicate accepted, double low, double high, double... values) {
        for (double value : values) {
            double inRange = SpecRanges.clamp(value, low, high);
            if (accepted.test(inRange)) {
                return OptionalDouble.of(inRange);
            }
        }
        return OptionalDouble.empty();
    }

    /** Bisects between an infeasible and a feasible point; returns a point on the feasible side. */
    private static double boundary(DoublePredicate ok, double infeasible, double feasible) {
        for (int i = 0; i < BOUNDARY_BISECTIONS; i++) {
            double mid = 0.5 * (infeasible + feasible);
            if (ok.test(mid)) {
                feasible = mid;
            } else {
                infeasible = mid;
            }
        }
        return feasible;
    }
}
