package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.ComputationCancelledException;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.CompanionBox;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import java.util.function.Supplier;

/**
 * The front door of the order-n robust design: the dominant pair whose order-n law, designed on the nominal
 * companion plant, meets the spec on every corner and seeded Monte Carlo sample of a companion box
 * ({@link HighOrderRobustSearch} judges each case by simulation, {@link SimulatedTargetSearch} searches; rule: least
 * bandwidth), then the order-n design of that pair as {@link HighOrderPipeline} computes it, the law over every
 * case, and each corner's certified H-infinity norm from w to z. With integral action and/or position-only sensing
 * ({@link #designLoop}) the loop that runs is judged instead, by the order-2 loop's rules ({@link RobustLoopSearch}).
 * Every failure is a {@link SolverFailure}; a box no
 * pair meets is INFEASIBLE_SPEC with the best spec the box allows. Stateless and thread-safe.
 */
public final class HighOrderRobustPipeline {

    /** Monte Carlo samples at most (each simulated, as the robust loop search). */
    public static final int MAX_SAMPLES = RobustDesignPipeline.MAX_LOOP_SAMPLES;

    private final HighOrderPipeline highOrder = new HighOrderPipeline();
    private final RealLoopPipeline realLoops = new RealLoopPipeline();

    /**
     * @param request       the order-n request on a companion plant (no state space, no spec matching)
     * @param box           the companion box (the nominal plant need not be a corner)
     * @param samples       Monte Carlo samples, 0 to {@value #MAX_SAMPLES}
     * @param actuatorLimit bound on max |u| of every case, or null
     * @throws SolverFailure INFEASIBLE_SPEC with the best spec the box allows, CAP_EXCEEDED at the robust search,
     *                       or as {@link HighOrderPipeline#design(HighOrderPipeline.Request, TargetDynamics)}
     */
    public HighOrderRobustReport design(
            HighOrderPipeline.Request request, CompanionBox box, int samples, long seed, Double actuatorLimit) {
        AcceptanceLimits limits = checked(request, box, samples);
        CompanionPlant plant = request.plant();
        TargetDynamics requested = new SpecInverter().invert(request.spec()).target();
        HighOrderRobustSearch search = new HighOrderRobustSearch(
                plant,
                request.auxiliary(),
                request.gammaChoice(),
                box,
                samples,
                seed,
                limits,
                actuatorLimit,
                request.stepSize());
        RobustTargetSearch.Outcome outcome = searched(() -> search.search(requested), limits, actuatorLimit);
        HighOrderPipeline.Result result = highOrder.design(request, outcome.target());
        HighOrderDesign design = result.design();
        List<HighOrderRobustReport.Case> cases = judgedCases(
                search.everyCase(),
                search.corners().size(),
                p -> search.metrics(design, p),
                p -> search.norm(design, p),
                limits,
                actuatorLimit);
        return new HighOrderRobustReport(result, requested, limits, actuatorLimit, outcome, samples, seed, cases, null);
    }

    /**
     * The robust design of the order-n loop with integral action and/or position-only sensing, by the rules of the
     * order-2 loop ({@link RobustLoopSearch}): for each target the law and observer are designed on the nominal
     * plant, each case is the exact zero-order-hold step of that law and observer on the perturbed companion plant,
     * rule least bandwidth; then the plain order-n design and the loop at the chosen pair, every case judged with
     * the loop that runs, and each corner's norm from w to z of that loop (compared with the augmented design's
     * gamma with integral action).
     *
     * @param request     the order-n request as {@link #design} takes it
     * @param loopRequest the loop of the same plant, spec, auxiliary placement and gamma choice
     * @throws SolverFailure as {@link #design} and {@link RealLoopPipeline#design}
     */
    public HighOrderRobustReport designLoop(
            HighOrderPipeline.Request request,
            RealLoopPipeline.Request loopRequest,
            CompanionBox box,
            int samples,
            long seed,
            Double actuatorLimit) {
        AcceptanceLimits limits = checked(request, box, samples);
        if (loopRequest.plant() != request.plant()) {
            throw new IllegalArgumentException("the loop must be designed on the request's plant");
        }
        RealLoopPipeline.checkStructure(loopRequest);
        TargetDynamics requested = new SpecInverter().invert(request.spec()).target();
        // the plain order-n design of the same pair must exist too (the response's gain and verification)
        HighOrderRobustSearch plain = new HighOrderRobustSearch(
                request.plant(),
                request.auxiliary(),
                request.gammaChoice(),
                box,
                0,
                seed,
                limits,
                actuatorLimit,
                request.stepSize());
        RobustLoopSearch<CompanionPlant> search = RobustLoopSearch.companion(
                realLoops,
                loopRequest,
                target -> plain.designAt(target) != null,
                box,
                samples,
                seed,
                limits,
                actuatorLimit,
                request.stepSize());
        RobustTargetSearch.Outcome outcome = searched(() -> search.search(requested), limits, actuatorLimit);
        TargetDynamics target = outcome.target();
        HighOrderPipeline.Result result = highOrder.design(request, target);
        RealLoopReport loop = realLoops.designAt(loopRequest, target);
        RealLoopPipeline.LoopParts parts = realLoops.partsAt(loopRequest, target);
        List<HighOrderRobustReport.Case> cases = judgedCases(
                search.everyCase(),
                search.corners().size(),
                p -> search.metrics(parts, p),
                p -> search.cornerNorm(parts, p),
                limits,
                actuatorLimit);
        return new HighOrderRobustReport(result, requested, limits, actuatorLimit, outcome, samples, seed, cases, loop);
    }

    /**
     * Every case judged with the chosen design: its step metrics, and at a corner its norm from w to z (a corner whose
     * norm cannot be computed leaves the design unverifiable).
     */
    private static List<HighOrderRobustReport.Case> judgedCases(
            List<CompanionPlant> all,
            int cornerCount,
            Function<CompanionPlant, StepMetrics> metrics,
            Function<CompanionPlant, Double> cornerNorm,
            AcceptanceLimits limits,
            Double actuatorLimit) {
        List<HighOrderRobustReport.Case> cases = new ArrayList<>();
        for (int i = 0; i < all.size(); i++) {
            boolean corner = i < cornerCount;
            CompanionPlant casePlant = all.get(i);
            StepMetrics m = metrics.apply(casePlant);
            Double norm = null;
            if (corner) {
                norm = cornerNorm.apply(casePlant);
                if (norm == null) {
                    throw SolverFailure.of(
                            SolverFailure.Kind.UNVERIFIABLE, "a corner's norm from w to z could not be computed", null);
                }
            }
            cases.add(new HighOrderRobustReport.Case(casePlant, corner, m, norm, meets(m, limits, actuatorLimit)));
        }
        return cases;
    }

    /** The limits of the request's spec, after the checks every robust order-n design shares. */
    private static AcceptanceLimits checked(HighOrderPipeline.Request request, CompanionBox box, int samples) {
        if (request.stateSpace() != null || request.matchSpecs()) {
            throw new IllegalArgumentException("a robust order-n design takes a companion plant without matching");
        }
        if (samples < 0 || samples > MAX_SAMPLES) {
            throw new IllegalArgumentException("samples must be 0 to " + MAX_SAMPLES);
        }
        if (box.order() != request.plant().order()) {
            throw new IllegalArgumentException("the box needs one range per denominator coefficient");
        }
        if (!(request.spec().timeSpec() instanceof TimeSpec.SettlingTime settling)) {
            throw new IllegalArgumentException("a robust order-n design is searched from a settling-time spec");
        }
        return new AcceptanceLimits(
                settling.seconds(), null, 100 * request.spec().overshootFraction(), request.bandFraction());
    }

    /** The search run, its failures as SolverFailures; a box no pair meets is INFEASIBLE_SPEC. */
    private static RobustTargetSearch.Outcome searched(
            Supplier<RobustTargetSearch.Outcome> search, AcceptanceLimits limits, Double actuatorLimit) {
        RobustTargetSearch.Outcome outcome;
        try {
            outcome = search.get();
        } catch (ComputationCancelledException e) {
            throw e;
        } catch (RobustTargetSearch.SearchCapException e) {
            throw SolverFailure.about(
                    SolverFailure.Kind.CAP_EXCEEDED, SolverFailure.ROBUST_SEARCH, -1, e.getMessage(), e);
        } catch (RuntimeException e) {
            throw SolverFailure.of(SolverFailure.Kind.CHECK_NOT_COMPUTABLE, e.getMessage(), e);
        }
        if (outcome.target() == null) {
            throw SolverFailure.infeasible(RobustDesignPipeline.infeasibility(limits, actuatorLimit, outcome), null);
        }
        return outcome;
    }

    private static boolean meets(StepMetrics m, AcceptanceLimits limits, Double actuatorLimit) {
        return m != null
                && limits.met(m.settlingTimeSeconds(), m.riseTimeSeconds(), m.overshootPercent())
                && (actuatorLimit == null || m.peakControl() <= actuatorLimit);
    }
}
