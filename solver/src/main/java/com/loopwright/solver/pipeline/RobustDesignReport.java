package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.robustness.UncertaintyReport;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;

/**
 * A robust design: the nominal design of the chosen target (verified against the spec as requested), how the
 * target was found, and the designed gains over every case of the box.
 *
 * @param report          the nominal design of the chosen target and its independent verification
 * @param requestedTarget the exact inversion of the requested spec
 * @param limits          the limits every case meets (the spec as requested, not widened)
 * @param actuatorLimit   the bound every case's max |u| meets, or null
 * @param search          the chosen target, evaluations and case count
 * @param uncertainty     the designed gains over the corners and samples (closed-form step metrics)
 * @param cornerNorms     each corner's certified H-infinity norm from w to z against the design's gamma
 * @param worstMetrics    the step metrics at the parameters of {@link #binding()} (null when nothing binds)
 * @param loop            the loop with integral action and/or an observer that was judged over the box (its cases
 *                        simulated), or null for the two-state full-state loop (judged in closed form)
 * @param sampled         the sample period every case was judged at and the nominal sampled step, or null when the
 *                        cases were judged in continuous time
 */
public record RobustDesignReport(
        DesignReport report,
        TargetDynamics requestedTarget,
        AcceptanceLimits limits,
        Double actuatorLimit,
        RobustTargetSearch.Outcome search,
        UncertaintyReport uncertainty,
        List<CornerNorm> cornerNorms,
        StepMetrics worstMetrics,
        RealLoopReport loop,
        SampledJudging sampled) {

    public RobustDesignReport {
        cornerNorms = List.copyOf(cornerNorms);
    }

    /** A robust design judged in continuous time. */
    public RobustDesignReport(
            DesignReport report,
            TargetDynamics requestedTarget,
            AcceptanceLimits limits,
            Double actuatorLimit,
            RobustTargetSearch.Outcome search,
            UncertaintyReport uncertainty,
            List<CornerNorm> cornerNorms,
            StepMetrics worstMetrics,
            RealLoopReport loop) {
        this(
                report,
                requestedTarget,
                limits,
                actuatorLimit,
                search,
                uncertainty,
                cornerNorms,
                worstMetrics,
                loop,
                null);
    }

    /**
     * The cases judged by the sampled loop as the exported controller runs it.
     *
     * @param samplePeriodSeconds T [s]
     * @param nominalMetrics      the nominal plant's sampled step with the designed controller
     */
    public record SampledJudging(double samplePeriodSeconds, StepMetrics nominalMetrics) {}

    /** The two-state full-state loop's robust design. */
    public RobustDesignReport(
            DesignReport report,
            TargetDynamics requestedTarget,
            AcceptanceLimits limits,
            Double actuatorLimit,
            RobustTargetSearch.Outcome search,
            UncertaintyReport uncertainty,
            List<CornerNorm> cornerNorms,
            StepMetrics worstMetrics) {
        this(report, requestedTarget, limits, actuatorLimit, search, uncertainty, cornerNorms, worstMetrics, null);
    }

    /**
     * @param plant          the corner's parameters
     * @param metrics        the corner's step metrics with the designed gains
     * @param hInfinityNorm  certified upper bound of the norm from w to z = [rho1 x1, rho2 x2, u] (0 when d = 0)
     * @param withinGamma    the norm is at most the design's gamma
     */
    public record CornerNorm(CanonicalPlant plant, UncertainCase metrics, double hInfinityNorm, boolean withinGamma) {}

    /** The metric closest to its limit over every case, as metric / limit. */
    public record Binding(String metric, double ratio, CanonicalPlant at) {}

    /**
     * Which limit binds: the largest ratio of a worst-case metric to its limit (settlingTime, riseTime,
     * overshootPercent, or peakControl against the actuator limit).
     */
    public Binding binding() {
        Binding best = new Binding("none", 0, null);
        best = larger(best, "settlingTime", uncertainty.settlingTime(), limits.settlingTimeSeconds());
        best = larger(best, "riseTime", uncertainty.riseTime(), limits.riseTimeSeconds());
        best = larger(best, "overshootPercent", uncertainty.overshootPercent(), limits.overshootPercent());
        return larger(best, "peakControl", uncertainty.peakControl(), actuatorLimit);
    }

    private static Binding larger(
            Binding best, String metric, com.loopwright.solver.robustness.MetricSummary summary, Double limit) {
        if (summary == null || limit == null || !(limit > 0)) {
            return best;
        }
        double ratio = summary.max() / limit;
        return ratio > best.ratio() ? new Binding(metric, ratio, summary.worstAt()) : best;
    }
}
