package com.loopwright.solver.pipeline;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.highorder.HighOrderDesigner;
import com.loopwright.solver.highorder.PoleMatchedRiccati;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.NoStabilizingSolutionException;
import com.loopwright.solver.robustness.AcceptanceLimits;
import com.loopwright.solver.robustness.CompanionBox;
import com.loopwright.solver.robustness.RobustTargetSearch;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.spec.AuxiliaryPlacement;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * The case judge of the order-n robust search: for a candidate dominant pair the order-n loop is designed on the
 * nominal companion plant as {@link HighOrderPipeline} designs it for a given target (auxiliary poles as requested,
 * no spec matching), and each case of the box is the exact zero-order-hold step of the nominal law
 * u = kr r - K z on the perturbed plant: A' - b' e_n K (last row -a' - b' K), reference input b' kr e_n, output
 * c z. A perturbed loop that is unstable fails its case. The search, its grid, rule and caps, is
 * {@link SimulatedTargetSearch}'s. One instance serves one search.
 */
final class HighOrderRobustSearch implements SimulatedTargetSearch.CaseJudge<HighOrderDesign> {

    private final HighOrderDesigner designer = new HighOrderDesigner();
    private final HInfinityNormCalculator norms = new HInfinityNormCalculator();
    private final CompanionPlant nominal;
    private final AuxiliaryPlacement auxiliary;
    private final GammaChoice gammaChoice;
    private final AcceptanceLimits limits;
    private final double stepSize;
    private final List<CompanionPlant> corners;
    private final List<CompanionPlant> everyCase;
    private final SimulatedTargetSearch<HighOrderDesign> search;

    HighOrderRobustSearch(
            CompanionPlant nominal,
            AuxiliaryPlacement auxiliary,
            GammaChoice gammaChoice,
            CompanionBox box,
            int samples,
            long seed,
            AcceptanceLimits limits,
            Double actuatorLimit,
            double stepSize) {
        this.nominal = nominal;
        this.auxiliary = auxiliary;
        this.gammaChoice = gammaChoice;
        this.limits = limits;
        this.stepSize = stepSize;
        this.corners = List.copyOf(box.corners(nominal));
        List<CompanionPlant> all = new ArrayList<>(corners);
        all.addAll(box.samples(nominal, samples, seed));
        this.everyCase = List.copyOf(all);
        this.search = new SimulatedTargetSearch<>(this, corners.size(), everyCase.size(), limits, actuatorLimit);
    }

    List<CompanionPlant> corners() {
        return corners;
    }

    List<CompanionPlant> everyCase() {
        return everyCase;
    }

    RobustTargetSearch.Outcome search(TargetDynamics requested) {
        return search.search(requested);
    }

    /** The order-n design on the nominal plant at the target, or null when none exists there. */
    @Override
    public HighOrderDesign designAt(TargetDynamics target) {
        try {
            return designer.design(nominal, auxiliary.place(target, nominal.order()), gammaChoice);
        } catch (InfeasibleDesignException
                | PoleMatchedRiccati.SystemFailure
                | NoStabilizingSolutionException
                | IllegalArgumentException e) {
            return null;
        }
    }

    @Override
    public StepMetrics metrics(HighOrderDesign design, int index) {
        return metrics(design, everyCase.get(index));
    }

    /**
     * The exact zero-order-hold step metrics of the nominal law on one plant (step of size r), or null when the
     * perturbed loop is unstable or its step is not measurable within the window.
     */
    StepMetrics metrics(HighOrderDesign design, CompanionPlant plant) {
        Cancellation.checkpoint();
        try {
            LinearLoop loop = loop(design, plant);
            double horizon = RealLoopPipeline.horizon(loop.a(), limits.settlingTimeSeconds());
            return new StepResponseMetrics()
                    .measure(
                            loop,
                            stepSize,
                            horizon,
                            RealLoopPipeline.samples(loop.a(), horizon),
                            limits.bandFraction());
        } catch (IllegalArgumentException e) {
            return null; // unstable, too fast to sample, or not settled within the window
        }
    }

    /**
     * The norm from w to z = [rho_1 z_1, ..., rho_n z_n, u] of the nominal law on one plant (the Hamiltonian
     * test, as the design's own certificate), or null when that loop is unstable or the norm is not computable.
     */
    Double norm(HighOrderDesign design, CompanionPlant plant) {
        try {
            int n = plant.order();
            double[] k = design.gain();
            double[] rho = design.weights();
            DMatrixRMaj performance = new DMatrixRMaj(n + 1, n);
            for (int j = 0; j < n; j++) {
                performance.set(j, j, rho[j]);
                performance.set(n, j, -k[j]);
            }
            return norms.compute(closedLoop(plant, k), plant.disturbanceInput(), performance)
                    .value();
        } catch (RuntimeException e) {
            return null;
        }
    }

    /** u = kr r - K z on the plant: A - b e_n K, reference input b kr e_n, output c, command -K z + kr r. */
    static LinearLoop loop(HighOrderDesign design, CompanionPlant plant) {
        int n = plant.order();
        double[] k = design.gain();
        double kr = design.referenceGain();
        DMatrixRMaj control = new DMatrixRMaj(1, n);
        for (int j = 0; j < n; j++) {
            control.set(0, j, -k[j]);
        }
        DMatrixRMaj reference = new DMatrixRMaj(n, 1);
        reference.set(n - 1, 0, plant.b() * kr);
        return new LinearLoop(closedLoop(plant, k), reference, plant.outputRow(), control, kr);
    }

    private static DMatrixRMaj closedLoop(CompanionPlant plant, double[] k) {
        int n = plant.order();
        DMatrixRMaj closed = plant.stateMatrix();
        for (int j = 0; j < n; j++) {
            closed.add(n - 1, j, -plant.b() * k[j]);
        }
        return closed;
    }
}
