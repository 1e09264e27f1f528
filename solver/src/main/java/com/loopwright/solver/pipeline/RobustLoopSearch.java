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
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.NoStabilizingSolutionException;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.CompanionBox;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.ParameterSampler;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Predicate;

/**
 * The robust target search for the loop with integral action and/or position-only sensing, for any plant form. There
 * is no closed form for these loops over the box: for each candidate target the loop is designed on the nominal
 * plant (the same machinery as {@link RealLoopPipeline}), and each case of the box is judged by the exact
 * zero-order-hold step of the perturbed loop (the plant perturbed, the law and observer as designed;
 * {@link OutputFeedbackLoop#closedOn}). A case P is a canonical plant (order 2, {@link #canonical}) or a perturbed
 * companion plant (order n, {@link #companion}); {@link CaseForm} turns it into the companion plant that is judged.
 * The search itself, its grid, rule and caps, is {@link SimulatedTargetSearch}'s. One instance serves one search.
 *
 * @param <P> the plant of one case as the report names it
 */
final class RobustLoopSearch<P> implements SimulatedTargetSearch.CaseJudge<RealLoopPipeline.LoopParts> {

    /** How a case becomes the judged companion plant, and how its norm from w to z scales. */
    interface CaseForm<P> {
        /** The companion plant the loop runs on in this case, with the nominal disturbance column. */
        CompanionPlant judged(P plant);

        /**
         * The factor of the norm from w to z of the case over that of {@link #judged} (the disturbance column
         * enters the norm linearly).
         */
        double normScale(P plant);
    }

    private final RealLoopPipeline loops;
    private final RealLoopPipeline.Request request;
    private final CaseForm<P> form;
    private final Predicate<TargetDynamics> alsoDesigned;
    private final AcceptanceLimits limits;
    private final double stepSize;
    private final List<P> corners;
    private final List<P> everyCase;
    private final SimulatedTargetSearch<RealLoopPipeline.LoopParts> search;
    private final HInfinityNormCalculator norms = new HInfinityNormCalculator();

    private RobustLoopSearch(
            RealLoopPipeline loops,
            RealLoopPipeline.Request request,
            CaseForm<P> form,
            Predicate<TargetDynamics> alsoDesigned,
            List<P> corners,
            List<P> samples,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double stepSize) {
        this.loops = loops;
        this.request = request;
        this.form = form;
        this.alsoDesigned = alsoDesigned;
        this.limits = limits;
        this.stepSize = stepSize;
        this.corners = List.copyOf(corners);
        List<P> all = new ArrayList<>(corners);
        all.addAll(samples);
        this.everyCase = List.copyOf(all);
        this.search = new SimulatedTargetSearch<>(this, corners.size(), everyCase.size(), limits, actuatorLimit);
    }

    /**
     * Order 2: the cases of a parameter box over the canonical plant, each judged as the companion plant of the
     * case with the nominal d (the step does not depend on d, and d may be 0) and its norm scaled by |d / d_nominal|.
     */
    static RobustLoopSearch<CanonicalPlant> canonical(
            RealLoopPipeline loops,
            RealLoopPipeline.Request request,
            CanonicalPlant nominal,
            ParameterBox box,
            int samples,
            long seed,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double stepSize) {
        List<CanonicalPlant> drawn = new ArrayList<>();
        ParameterSampler sampler = new ParameterSampler(box, seed);
        for (int s = 0; s < samples; s++) {
            drawn.add(ParameterBox.plant(sampler.next()));
        }
        CaseForm<CanonicalPlant> form = new CaseForm<>() {
            @Override
            public CompanionPlant judged(CanonicalPlant plant) {
                return IntegralAugmentation.companionOf(
                        new CanonicalPlant(plant.a0(), plant.a1(), plant.b(), nominal.d()));
            }

            @Override
            public double normScale(CanonicalPlant plant) {
                return Math.abs(plant.d() / nominal.d());
            }
        };
        return new RobustLoopSearch<>(
                loops, request, form, target -> true, box.corners(), drawn, limits, actuatorLimit, stepSize);
    }

    /**
     * Order n: the cases of a companion box (the nominal numerator and disturbance kept, so each case is judged as
     * it is and its norm is not scaled).
     *
     * @param alsoDesigned a target counts only when this holds there too (the plain order-n design exists)
     */
    static RobustLoopSearch<CompanionPlant> companion(
            RealLoopPipeline loops,
            RealLoopPipeline.Request request,
            Predicate<TargetDynamics> alsoDesigned,
            CompanionBox box,
            int samples,
            long seed,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double stepSize) {
        CaseForm<CompanionPlant> form = new CaseForm<>() {
            @Override
            public CompanionPlant judged(CompanionPlant plant) {
                return plant;
            }

            @Override
            public double normScale(CompanionPlant plant) {
                return 1;
            }
        };
        CompanionPlant nominal = request.plant();
        return new RobustLoopSearch<>(
                loops,
                request,
                form,
                alsoDesigned,
                box.corners(nominal),
                box.samples(nominal, samples, seed),
                limits,
                actuatorLimit,
                stepSize);
    }

    AcceptanceLimits limits() {
        return limits;
    }

    List<P> corners() {
        return corners;
    }

    List<P> everyCase() {
        return everyCase;
    }

    RobustTargetSearch.Outcome search(TargetDynamics requested) {
        return search.search(requested);
    }

    /** The loop designed on the nominal plant for the target, or null when no design exists there. */
    @Override
    public RealLoopPipeline.LoopParts designAt(TargetDynamics target) {
        try {
            RealLoopPipeline.LoopParts parts = loops.partsAt(request, target);
            return alsoDesigned.test(target) ? parts : null;
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
    StepMetrics metrics(RealLoopPipeline.LoopParts parts, P plant) {
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
     * The norm from w to z of the continuous perturbed loop (scaled by {@link CaseForm#normScale}), or null when it
     * cannot be computed.
     */
    Double cornerNorm(RealLoopPipeline.LoopParts parts, P plant) {
        try {
            LoopSystem loop = perturbed(parts, plant);
            return form.normScale(plant)
                    * norms.compute(loop.a(), loop.disturbance(), loop.performance())
                            .value();
        } catch (RuntimeException e) {
            return null;
        }
    }

    /** The perturbed loop: the case's plant with the nominal law and observer. */
    private LoopSystem perturbed(RealLoopPipeline.LoopParts parts, P plant) {
        return OutputFeedbackLoop.closedOn(
                form.judged(plant),
                request.plant(),
                request.plant().outputRow().data,
                parts.law(),
                parts.observerGain(),
                parts.weights());
    }
}
