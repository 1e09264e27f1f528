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
 * The search itself, its grid, rule and caps, is {@link SimulatedTargetSearch}'s. One instance serves one search.
 */
final class RobustLoopSearch implements SimulatedTargetSearch.CaseJudge<RealLoopPipeline.LoopParts> {

    private final RealLoopPipeline loops;
    private final RealLoopPipeline.Request request;
    private final CanonicalPlant nominal;
    private final AcceptanceLimits limits;
    private final double stepSize;
    private final List<CanonicalPlant> corners;
    private final List<CanonicalPlant> everyCase;
    private final SimulatedTargetSearch<RealLoopPipeline.LoopParts> search;
    private final HInfinityNormCalculator norms = new HInfinityNormCalculator();

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
        this.loops = loops;
        this.request = request;
        this.nominal = nominal;
        this.limits = limits;
        this.stepSize = stepSize;
        this.corners = box.corners();
        List<CanonicalPlant> all = new ArrayList<>(corners);
        ParameterSampler sampler = new ParameterSampler(box, seed);
        for (int s = 0; s < samples; s++) {
            all.add(ParameterBox.plant(sampler.next()));
        }
        this.everyCase = List.copyOf(all);
        this.search = new SimulatedTargetSearch<>(this, corners.size(), everyCase.size(), limits, actuatorLimit);
    }

    List<CanonicalPlant> corners() {
        return corners;
    }

    List<CanonicalPlant> everyCase() {
        return everyCase;
    }

    RobustTargetSearch.Outcome search(TargetDynamics requested) {
        return search.search(requested);
    }

    /** The loop designed on the nominal plant for the target, or null when no design exists there. */
    @Override
    public RealLoopPipeline.LoopParts designAt(TargetDynamics target) {
        try {
            return loops.partsAt(request, target);
        } catch (InfeasibleDesignException
                | PoleMatchedRiccati.SystemFailure
                | NoStabilizingSolutionException
                | IllegalArgumentException e) {
            return null;
        }
    }

    @Override
    public StepMetrics metrics(RealLoopPipeline.LoopParts parts, int index) {
        return metrics(parts, everyCase.get(index));
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

    /**
     * One case judged for the report: its step metrics and, at a corner, the norm from w to z of the perturbed loop
     * (the disturbance column is [0, d]: the norm scales with |d| / |d_nominal|, so it is computed with the nominal
     * d and scaled).
     */
    UncertainCase judged(RealLoopPipeline.LoopParts parts, CanonicalPlant plant, boolean corner) {
        StepMetrics m = metrics(parts, plant);
        Double gain = null;
        if (corner && m != null) {
            gain = cornerNorm(parts, plant);
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

    /**
     * The norm from w to z of the continuous perturbed loop (the disturbance column is [0, d]: the norm scales with
     * |d| / |d_nominal|, so it is computed with the nominal d and scaled), or null when it cannot be computed.
     */
    Double cornerNorm(RealLoopPipeline.LoopParts parts, CanonicalPlant plant) {
        try {
            LoopSystem loop = perturbed(parts, plant);
            return Math.abs(plant.d() / nominal.d())
                    * norms.compute(loop.a(), loop.disturbance(), loop.performance())
                            .value();
        } catch (RuntimeException e) {
            return null;
        }
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
