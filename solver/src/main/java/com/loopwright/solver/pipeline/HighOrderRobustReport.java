package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import java.util.function.Function;

/**
 * An order-n robust design: the order-n design of the chosen dominant pair (verified as any order-n design), how the
 * pair was found, and the nominal law over every corner and sample of the companion box.
 *
 * @param design          the order-n design at the chosen target and its verification
 * @param requestedTarget the exact inversion of the requested spec
 * @param limits          the limits every case meets (the spec as requested, not widened)
 * @param actuatorLimit   the bound every case's max |u| meets, or null
 * @param search          the chosen target, evaluations and case count
 * @param sampleCount     Monte Carlo samples
 * @param seed            their seed
 * @param cases           every case judged, the corners first
 * @param judgedLoop      the loop with integral action and/or an observer judged over the box (designed at the
 *                        chosen pair), or null when the full-state law is judged
 */
public record HighOrderRobustReport(
        HighOrderPipeline.Result design,
        TargetDynamics requestedTarget,
        AcceptanceLimits limits,
        Double actuatorLimit,
        RobustTargetSearch.Outcome search,
        int sampleCount,
        long seed,
        List<Case> cases,
        RealLoopReport judgedLoop) {

    public HighOrderRobustReport {
        cases = List.copyOf(cases);
    }

    /**
     * One case of the box with the nominal law.
     *
     * @param plant         the perturbed companion plant (the nominal numerator and disturbance)
     * @param corner        a corner of the box, else a Monte Carlo sample
     * @param metrics       the exact step metrics, or null when the loop is unstable there or not measurable
     * @param hInfinityNorm corners only: the certified norm from w to z of the perturbed loop, else null
     * @param meetsSpec     measured and within the limits (settling, overshoot, and the actuator limit)
     */
    public record Case(
            CompanionPlant plant, boolean corner, StepMetrics metrics, Double hInfinityNorm, boolean meetsSpec) {}

    /** The metric closest to its limit over every case, as metric / limit, and the case it occurs at. */
    public record Binding(String metric, double ratio, Case at) {}

    /** The gamma each corner norm is compared with: the judged loop's (augmented with integral action), else the design's. */
    public double gamma() {
        return judgedLoop != null
                ? judgedLoop.design().gamma()
                : design.design().gamma();
    }

    /** The corners, in {@link com.loopwright.solver.robustness.CompanionBox} order. */
    public List<Case> corners() {
        return cases.stream().filter(Case::corner).toList();
    }

    /** Every corner and sample meets the limits (an unstable or unmeasured case does not). */
    public boolean meetsEverywhere() {
        return cases.stream().allMatch(Case::meetsSpec);
    }

    /**
     * Which limit binds: the largest ratio of a case's metric to its limit (settlingTime, overshootPercent, or
     * peakControl against the actuator limit), over the measured cases; null when no case is measured.
     */
    public Binding binding() {
        Binding best = null;
        for (Case c : cases) {
            if (c.metrics() == null) {
                continue;
            }
            best = larger(best, "settlingTime", c.metrics().settlingTimeSeconds(), limits.settlingTimeSeconds(), c);
            best = larger(best, "overshootPercent", c.metrics().overshootPercent(), limits.overshootPercent(), c);
            best = larger(best, "peakControl", c.metrics().peakControl(), actuatorLimit, c);
        }
        return best;
    }

    /** The largest value of a metric over the measured cases (0 when none is measured). */
    public double worst(Function<StepMetrics, Double> metric) {
        double worst = 0;
        for (Case c : cases) {
            if (c.metrics() != null && metric.apply(c.metrics()) != null) {
                worst = Math.max(worst, metric.apply(c.metrics()));
            }
        }
        return worst;
    }

    private static Binding larger(Binding best, String metric, Double value, Double limit, Case at) {
        if (value == null || limit == null || !(limit > 0)) {
            return best;
        }
        double ratio = value / limit;
        return best == null || ratio > best.ratio() ? new Binding(metric, ratio, at) : best;
    }
}
