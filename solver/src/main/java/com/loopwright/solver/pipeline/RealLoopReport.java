package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.LoadStepResponse;
import com.loopwright.solver.design.ObserverDesign;
import com.loopwright.solver.design.OutputFeedbackFigures;
import com.loopwright.solver.design.PlantInputMargins;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;

/**
 * One designed loop with integral action and/or an observer.
 *
 * @param structure           the loop structure asked for
 * @param target              the dominant pair from the specs
 * @param design              the pole-matched design: of the augmented plant (order n + 1) with integral action,
 *                            of the plant otherwise; its gamma, gamma_min, weights and feasible set
 * @param law                 u = kr r + ki xi - K x_hat
 * @param stateFeedbackNorm   the closed-loop H-infinity norm from w to z of the state-feedback loop (at most gamma:
 *                            the certificate)
 * @param stateFeedbackStep   the state-feedback loop's reference step
 * @param stateFeedbackMargins margins at the plant input of the state-feedback loop
 * @param observer            the observer, null with full-state sensing
 * @param outputFeedback      the full output-feedback loop's figures, null with full-state sensing
 * @param specCheck           the step of the loop that runs (full loop with an observer) against the specs
 * @param loadStep            the load step of the loop that runs
 * @param notes               how the design was made (observer method, what the certificate covers)
 */
public record RealLoopReport(
        LoopStructure structure,
        TargetDynamics target,
        HighOrderDesign design,
        TrackingLaw law,
        HInfinityNorm stateFeedbackNorm,
        StepMetrics stateFeedbackStep,
        PlantInputMargins stateFeedbackMargins,
        ObserverDesign observer,
        OutputFeedbackFigures outputFeedback,
        HighOrderPipeline.SpecCheck specCheck,
        LoadStepResponse loadStep,
        List<String> notes) {

    public RealLoopReport {
        notes = List.copyOf(notes);
    }
}
