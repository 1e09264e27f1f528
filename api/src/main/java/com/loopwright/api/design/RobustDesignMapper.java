package com.loopwright.api.design;

import com.loopwright.api.robustness.RobustnessResponse;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.pipeline.LoopStructure;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.pipeline.RobustDesignReport;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.MetricSummary;
import com.loopwright.solver.robustness.UncertainCase;
import com.loopwright.solver.robustness.UncertaintyReport;
import com.loopwright.solver.spec.TargetDynamics;

/** The robust design's solver report to the wire record of the design response's robust member. */
public final class RobustDesignMapper {

    /** The one selection rule (RobustTargetSearch): the smallest natural frequency meeting every case. */
    static final String SELECTION_RULE = "leastBandwidth";

    RobustDesign toResponse(RobustDesignReport robust) {
        UncertaintyReport box = robust.uncertainty();
        RobustDesignReport.Binding binding = robust.binding();
        StepMetrics worst = robust.worstMetrics();
        AcceptanceLimits limits = robust.limits();
        RealLoopReport loop = robust.loop();
        RobustDesignReport.SampledJudging sampled = robust.sampled();
        StepMetrics nominal = sampled != null
                ? sampled.nominalMetrics()
                : loop == null ? robust.report().stepMetrics() : runningStep(loop);
        TargetDynamics target = loop == null ? robust.report().design().target() : loop.target();
        double gamma =
                loop == null ? robust.report().design().gamma() : loop.design().gamma();
        return new RobustDesign(
                SELECTION_RULE,
                point(target),
                point(robust.requestedTarget()),
                box.cornerCount(),
                box.sampleCount(),
                box.seed(),
                robust.search().evaluations(),
                robust.search().caseEvaluations(),
                box.meetingFraction() != null && box.meetingFraction() == 1.0 && withinActuator(robust),
                worst == null
                        ? null
                        : new RobustDesign.WorstCase(
                                plant(binding.at()), binding.metric(), binding.ratio(), metrics(worst)),
                new RobustDesign.Price(
                        new RobustnessResponse.Acceptance(
                                limits.settlingTimeSeconds(),
                                limits.riseTimeSeconds(),
                                limits.overshootPercent(),
                                100 * limits.bandFraction(),
                                0,
                                robust.report().stepSize()),
                        metrics(nominal),
                        new RobustnessResponse.Metrics(
                                max(box.riseTime()),
                                max(box.settlingTime()),
                                box.overshootPercent() == null
                                        ? 0
                                        : box.overshootPercent().max(),
                                box.peakControl() == null
                                        ? 0
                                        : box.peakControl().max()),
                        target.naturalFrequencyRadPerSec()
                                / robust.requestedTarget().naturalFrequencyRadPerSec()),
                robust.actuatorLimit(),
                gamma,
                robust.cornerNorms().stream()
                        .map(c -> new RobustDesign.Corner(
                                plant(c.plant()), metrics(c.metrics()), c.hInfinityNorm(), c.withinGamma()))
                        .toList(),
                judgedLoop(loop, sampled),
                sampled == null ? null : sampled.samplePeriodSeconds());
    }

    /** The loop that runs: the full output-feedback loop with an observer, else the state-feedback loop. */
    private static StepMetrics runningStep(RealLoopReport loop) {
        return loop.outputFeedback() == null
                ? loop.stateFeedbackStep()
                : loop.outputFeedback().step();
    }

    /**
     * The judged loop's name on the wire: null for the full-state loop in continuous time (closed form), the loop's
     * structure, prefixed "sampled" when the cases were judged at a sample period.
     */
    static String judgedLoop(RealLoopReport loop, RobustDesignReport.SampledJudging sampled) {
        if (sampled == null) {
            return loop == null ? null : judgedLoop(loop.structure());
        }
        if (loop == null) {
            return "sampledStateFeedback";
        }
        String name = judgedLoop(loop.structure());
        return "sampled" + Character.toUpperCase(name.charAt(0)) + name.substring(1);
    }

    /** The judged loop's name on the wire, in continuous time (the order-n robust member names it so too). */
    public static String judgedLoop(LoopStructure structure) {
        boolean observer = structure.measurement() == LoopStructure.Measurement.POSITION;
        if (structure.integralAction()) {
            return observer ? "integralActionPositionObserver" : "integralAction";
        }
        return "positionObserver";
    }

    private static boolean withinActuator(RobustDesignReport robust) {
        MetricSummary control = robust.uncertainty().peakControl();
        return robust.actuatorLimit() == null || (control != null && control.max() <= robust.actuatorLimit());
    }

    private static Double max(MetricSummary summary) {
        return summary == null ? null : summary.max();
    }

    private static RobustDesign.TargetPoint point(TargetDynamics target) {
        return new RobustDesign.TargetPoint(target.dampingRatio(), target.naturalFrequencyRadPerSec());
    }

    private static RobustnessResponse.PlantView plant(CanonicalPlant plant) {
        return new RobustnessResponse.PlantView(plant.a0(), plant.a1(), plant.b(), plant.d());
    }

    private static RobustnessResponse.Metrics metrics(StepMetrics m) {
        return new RobustnessResponse.Metrics(
                m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(), m.peakControl());
    }

    private static RobustnessResponse.Metrics metrics(UncertainCase c) {
        return new RobustnessResponse.Metrics(
                c.riseTimeSeconds(),
                c.settlingTimeSeconds(),
                c.overshootPercent() == null ? 0 : c.overshootPercent(),
                c.peakControl() == null ? 0 : c.peakControl());
    }
}
