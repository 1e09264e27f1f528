package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import java.util.Locale;
import java.util.function.Supplier;

/**
 * The rules of a robust design judged at a sample period: when a period cannot work for the spec, how a period
 * failure becomes a {@link SolverFailure} about {@link SolverFailure#ROBUST_SAMPLE_PERIOD}, and what the infeasible
 * answer proposes at the period. Static and stateless.
 */
final class SampledRobustRules {

    private SampledRobustRules() {}

    /** The chosen design's sampled metrics (null when not measurable), its period failure as a SolverFailure. */
    static StepMetrics sampledMetrics(Supplier<StepMetrics> run) {
        try {
            return run.get();
        } catch (SamplePeriodException e) {
            throw samplePeriodFailure(e.getMessage(), e);
        }
    }

    static StepMetrics requireNominal(StepMetrics nominal) {
        if (nominal == null) {
            throw SolverFailure.of(
                    SolverFailure.Kind.UNVERIFIABLE, "the nominal sampled loop's step could not be measured", null);
        }
        return nominal;
    }

    static UncertainCase sampledCase(Supplier<UncertainCase> run) {
        try {
            return run.get();
        } catch (SamplePeriodException e) {
            throw samplePeriodFailure(e.getMessage(), e);
        }
    }

    static SolverFailure samplePeriodFailure(String message, Throwable cause) {
        return SolverFailure.about(
                SolverFailure.Kind.SAMPLED_LAW_INFEASIBLE, SolverFailure.ROBUST_SAMPLE_PERIOD, -1, message, cause);
    }

    /**
     * The period leaves the search a bracket: the exported law needs wn T &lt;= 0.5, so no target above 0.5 / T; the
     * search starts at wn_req / {@value RobustTargetSearch#FREQUENCY_SPAN}. A period above
     * 0.5 {@value RobustTargetSearch#FREQUENCY_SPAN} / wn_req therefore cannot work for the spec.
     */
    static void requireReachable(TargetDynamics requested, double samplePeriod, AcceptanceLimits limits) {
        double lowest = requested.naturalFrequencyRadPerSec() / RobustTargetSearch.FREQUENCY_SPAN;
        if (SampledLawJudge.frequencyCeiling(samplePeriod) > lowest) {
            return;
        }
        throw samplePeriodFailure(
                String.format(
                        Locale.US,
                        "the sample period %.6g s is too long for this spec: %s; the exported law needs wn T <= %.2g,"
                                + " so wn <= %.6g rad/s, below the slowest target the search tries (%.6g rad/s, a"
                                + " sixteenth of the requested natural frequency); a period above %.4g s cannot work"
                                + " for this spec",
                        samplePeriod,
                        periods(limits, samplePeriod),
                        SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT,
                        SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT / samplePeriod,
                        lowest,
                        SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT / lowest),
                null);
    }

    /** "the settling time 0.12 s is 1.2 sample periods" (or the rise time). */
    static String periods(AcceptanceLimits limits, double samplePeriod) {
        boolean rise = limits.settlingTimeSeconds() == null;
        double time = rise ? limits.riseTimeSeconds() : limits.settlingTimeSeconds();
        return String.format(
                Locale.US,
                "the %s %.6g s is %.3g sample periods",
                rise ? "rise time" : "settling time",
                time,
                time / samplePeriod);
    }

    /**
     * No target meets the spec at the period: the infeasible-spec answer with the best spec the box allows at this
     * period when one was found; else the period is the obstacle (422 at robust.samplePeriod).
     */
    static SolverFailure sampledInfeasible(
            AcceptanceLimits limits, Double actuatorLimit, RobustTargetSearch.Outcome outcome, double samplePeriod) {
        String atPeriod = String.format(
                Locale.US,
                " judged sampled at samplePeriod %.6g s (%s; the exported controller needs wn T <= %.2g and every"
                        + " case's sampled loop stable)",
                samplePeriod,
                periods(limits, samplePeriod),
                SampledLawDesigner.MAX_PERIOD_PER_TIME_CONSTANT);
        if (outcome.proposedTimeSeconds() == null && outcome.proposedOvershootPercent() == null) {
            return samplePeriodFailure(
                    String.format(
                            Locale.US,
                            "no nominal target meets the spec on all %d cases of the box%s, and no slower spec was"
                                    + " found that they meet; shorten the sample period",
                            outcome.caseCount(),
                            atPeriod),
                    null);
        }
        Infeasibility box = RobustDesignPipeline.infeasibility(limits, actuatorLimit, outcome);
        List<SpecProposal> proposals = box.proposals().stream()
                .map(p -> new SpecProposal(
                        p.quantity(),
                        p.value(),
                        p.note() + String.format(Locale.US, ", at samplePeriod %.6g s", samplePeriod)))
                .toList();
        return SolverFailure.infeasible(new Infeasibility(box.quantity(), box.reason() + atPeriod, proposals), null);
    }
}
