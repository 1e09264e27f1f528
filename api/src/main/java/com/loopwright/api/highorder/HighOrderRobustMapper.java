package com.loopwright.api.highorder;

import com.loopwright.api.design.RobustDesign;
import com.loopwright.api.design.RobustDesignMapper;
import com.loopwright.api.robustness.RobustnessResponse;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.pipeline.HighOrderRobustReport;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.spec.TargetDynamics;

/** The order-n robust design's solver report to the wire record of the high-order response's robust member. */
final class HighOrderRobustMapper {

    /** The one selection rule (SimulatedTargetSearch): the smallest natural frequency meeting every case. */
    static final String SELECTION_RULE = "leastBandwidth";

    HighOrderRobustDesign toResponse(HighOrderRobustReport robust, double stepSize) {
        HighOrderRobustReport.Binding binding = robust.binding();
        AcceptanceLimits limits = robust.limits();
        TargetDynamics target = robust.design().design().poles().dominant();
        RealLoopReport loop = robust.judgedLoop();
        StepMetrics nominal = loop == null
                ? robust.design().verification().step().metrics()
                : loop.outputFeedback() == null
                        ? loop.stateFeedbackStep()
                        : loop.outputFeedback().step();
        return new HighOrderRobustDesign(
                SELECTION_RULE,
                point(target),
                point(robust.requestedTarget()),
                robust.corners().size(),
                robust.sampleCount(),
                robust.seed(),
                robust.search().evaluations(),
                robust.search().caseEvaluations(),
                robust.meetsEverywhere(),
                binding == null
                        ? null
                        : new HighOrderRobustDesign.WorstCase(
                                plant(binding.at().plant()),
                                binding.metric(),
                                binding.ratio(),
                                metrics(binding.at().metrics())),
                new RobustDesign.Price(
                        new RobustnessResponse.Acceptance(
                                limits.settlingTimeSeconds(),
                                null,
                                limits.overshootPercent(),
                                100 * limits.bandFraction(),
                                0,
                                stepSize),
                        metrics(nominal),
                        new RobustnessResponse.Metrics(
                                robust.worst(StepMetrics::riseTimeSeconds),
                                robust.worst(StepMetrics::settlingTimeSeconds),
                                robust.worst(StepMetrics::overshootPercent),
                                robust.worst(StepMetrics::peakControl)),
                        target.naturalFrequencyRadPerSec()
                                / robust.requestedTarget().naturalFrequencyRadPerSec()),
                robust.actuatorLimit(),
                robust.gamma(),
                robust.corners().stream()
                        .map(c -> new HighOrderRobustDesign.Corner(
                                plant(c.plant()),
                                c.metrics() == null ? null : metrics(c.metrics()),
                                c.hInfinityNorm(),
                                c.hInfinityNorm() <= robust.gamma()))
                        .toList(),
                loop == null ? null : RobustDesignMapper.judgedLoop(loop.structure()));
    }

    private static RobustDesign.TargetPoint point(TargetDynamics target) {
        return new RobustDesign.TargetPoint(target.dampingRatio(), target.naturalFrequencyRadPerSec());
    }

    static HighOrderRobustDesign.CasePlant plant(CompanionPlant plant) {
        return new HighOrderRobustDesign.CasePlant(CoefficientOrder.monicHighestFirst(plant.denominator()), plant.b());
    }

    private static RobustnessResponse.Metrics metrics(StepMetrics m) {
        return new RobustnessResponse.Metrics(
                m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(), m.peakControl());
    }
}
