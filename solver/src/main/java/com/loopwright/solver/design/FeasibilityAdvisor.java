package com.loopwright.solver.design;

import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.OvershootDamping;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.function.DoublePredicate;

/**
 * Nearest specs a plant can meet, found numerically: keep the overshoot and move the natural frequency (a
 * shorter or longer time spec), or keep the time spec and move the damping ratio (another overshoot). Each
 * search walks a capped geometric or linear grid outward from the infeasible spec, then bisects the
 * feasibility boundary and steps just inside it.
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

    public FeasibilityAdvisor(ClosedFormDesigner designer) {
        this.designer = designer;
    }

    /** Proposals for a spec whose target has an obstacle (either list element may be missing). */
    public List<SpecProposal> propose(CanonicalPlant plant, DesignSpec spec) {
        List<SpecProposal> proposals = new ArrayList<>(2);
        double zeta = OvershootDamping.dampingRatio(spec.overshootFraction());
        TimeSpec timeSpec = spec.timeSpec();
        double normalizedTime = timeSpec.normalizedTime(zeta);
        double wn = normalizedTime / timeSpec.seconds();
        nearestFeasibleFrequency(plant, zeta, wn).ifPresent(feasibleWn -> proposals.add(new SpecProposal(
                SpecQuantity.TIME_SPEC, normalizedTime / feasibleWn,
                "keeps the overshoot and moves the natural frequency just inside the feasible range")));
        nearestFeasibleDamping(plant, timeSpec, zeta).ifPresent(feasibleZeta -> proposals.add(new SpecProposal(
                SpecQuantity.OVERSHOOT_PERCENT, 100 * OvershootDamping.overshoot(feasibleZeta),
                "keeps the time spec and moves the damping ratio just inside the feasible range")));
        return proposals;
    }

    private boolean feasible(CanonicalPlant plant, double zeta, double wn) {
        if (!(wn > 0) || !Double.isFinite(wn)) {
            return false;
        }
        return designer.obstacle(plant, new TargetDynamics(zeta, wn)).isEmpty();
    }

    private OptionalDouble nearestFeasibleFrequency(CanonicalPlant plant, double zeta, double wn) {
        DoublePredicate ok = w -> feasible(plant, zeta, w);
        for (int step = 1; step <= FREQUENCY_STEPS; step++) {
            double factor = Math.pow(FREQUENCY_STEP, step);
            for (double candidate : new double[] {wn * factor, wn / factor}) {
                if (ok.test(candidate)) {
                    double outside = candidate > wn ? candidate / FREQUENCY_STEP : candidate * FREQUENCY_STEP;
                    double edge = boundary(ok, outside, candidate);
                    double inside = edge * (candidate > wn ? 1 + INSIDE_MARGIN : 1 - INSIDE_MARGIN);
                    return OptionalDouble.of(ok.test(inside) ? inside : candidate);
                }
            }
        }
        return OptionalDouble.empty();
    }

    private OptionalDouble nearestFeasibleDamping(CanonicalPlant plant, TimeSpec timeSpec, double zeta) {
        DoublePredicate ok = z -> feasible(plant, z, timeSpec.normalizedTime(z) / timeSpec.seconds());
        int steps = (int) Math.ceil((DAMPING_MAX - DAMPING_MIN) / DAMPING_STEP);
        for (int step = 1; step <= steps; step++) {
            for (double candidate : new double[] {zeta + step * DAMPING_STEP, zeta - step * DAMPING_STEP}) {
                if (candidate >= DAMPING_MIN && candidate <= DAMPING_MAX && ok.test(candidate)) {
                    double outside = candidate > zeta ? candidate - DAMPING_STEP : candidate + DAMPING_STEP;
                    double edge = boundary(ok, outside, candidate);
                    double inside = edge + (candidate > zeta ? DAMPING_INSIDE : -DAMPING_INSIDE);
                    return OptionalDouble.of(ok.test(inside) ? inside : candidate);
                }
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
