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

/**
 * The front door of the order-n robust design: the dominant pair whose order-n law, designed on the nominal
 * companion plant, meets the spec on every corner and seeded Monte Carlo sample of a companion box
 * ({@link HighOrderRobustSearch} judges each case by simulation, {@link SimulatedTargetSearch} searches; rule: least
 * bandwidth), then the order-n design of that pair as {@link HighOrderPipeline} computes it, the law over every
 * case, and each corner's certified H-infinity norm from w to z. Every failure is a {@link SolverFailure}; a box no
 * pair meets is INFEASIBLE_SPEC with the best spec the box allows. Stateless and thread-safe.
 */
public final class HighOrderRobustPipeline {

    /** Monte Carlo samples at most (each simulated, as the robust loop search). */
    public static final int MAX_SAMPLES = RobustDesignPipeline.MAX_LOOP_SAMPLES;

    private final HighOrderPipeline highOrder = new HighOrderPipeline();

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
        if (request.stateSpace() != null || request.matchSpecs()) {
            throw new IllegalArgumentException("a robust order-n design takes a companion plant without matching");
        }
        if (samples < 0 || samples > MAX_SAMPLES) {
            throw new IllegalArgumentException("samples must be 0 to " + MAX_SAMPLES);
        }
        CompanionPlant plant = request.plant();
        if (box.order() != plant.order()) {
            throw new IllegalArgumentException("the box needs one range per denominator coefficient");
        }
        AcceptanceLimits limits = new AcceptanceLimits(
                ((TimeSpec.SettlingTime) request.spec().timeSpec()).seconds(),
                null,
                100 * request.spec().overshootFraction(),
                request.bandFraction());
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
        RobustTargetSearch.Outcome outcome;
        try {
            outcome = search.search(requested);
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
        HighOrderPipeline.Result result = highOrder.design(request, outcome.target());
        HighOrderDesign design = result.design();
        List<HighOrderRobustReport.Case> cases = new ArrayList<>();
        List<CompanionPlant> all = search.everyCase();
        for (int i = 0; i < all.size(); i++) {
            boolean corner = i < search.corners().size();
            CompanionPlant casePlant = all.get(i);
            StepMetrics m = search.metrics(design, casePlant);
            Double norm = null;
            if (corner) {
                norm = search.norm(design, casePlant);
                if (norm == null) {
                    throw SolverFailure.of(
                            SolverFailure.Kind.UNVERIFIABLE, "a corner's norm from w to z could not be computed", null);
                }
            }
            boolean meets = m != null
                    && limits.met(m.settlingTimeSeconds(), m.riseTimeSeconds(), m.overshootPercent())
                    && (actuatorLimit == null || m.peakControl() <= actuatorLimit);
            cases.add(new HighOrderRobustReport.Case(casePlant, corner, m, norm, meets));
        }
        return new HighOrderRobustReport(result, requested, limits, actuatorLimit, outcome, samples, seed, cases);
    }
}
