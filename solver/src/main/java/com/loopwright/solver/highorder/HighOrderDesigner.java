package com.loopwright.solver.highorder;

import com.loopwright.solver.design.GammaBound;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.GammaCondition;
import com.loopwright.solver.design.GammaInterval;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.PoleMatchedSolution;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.DesiredPoles;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * Pole-matched H-infinity design of order n. The feasible gamma set, a union of intervals, comes from
 * {@link FeasibleGammaSearch} (continuation in 1/gamma^2 from gamma = infinity, ends refined by a bracketing
 * solver, every interval checked by the Hamiltonian Riccati solver); no requirement is assumed monotone in gamma.
 * A requested gamma outside the set gets a search for another solution branch through it before it is refused.
 */
public final class HighOrderDesigner {

    private final FeasibleGammaSearch search = new FeasibleGammaSearch();

    public HighOrderDesign design(CompanionPlant plant, DesiredPoles poles, GammaChoice choice) {
        if (poles.order() != plant.order()) {
            throw new IllegalArgumentException("need " + plant.order() + " poles, got " + poles.order());
        }
        double[] desired = poles.coefficients();
        int conditions = plant.order() + 2;
        FeasibleGammaSearch.FeasibleGammaSet set = search.search(plant, desired);
        List<String> notes = new ArrayList<>();
        double gamma;
        if (choice instanceof GammaChoice.Fixed fixed) {
            gamma = fixed.gamma();
            if (!set.contains(gamma)) {
                set = search.seek(plant, desired, set, gamma);
            }
            if (set.isEmpty()) {
                throw noGamma(plant, desired, poles, set);
            }
            if (!set.contains(gamma)) {
                throw new InfeasibleDesignException(new Infeasibility(
                        SpecQuantity.GAMMA,
                        String.format(
                                "gamma %.6g is outside the feasible gamma set %s: some Riccati requirement fails at this"
                                        + " gamma",
                                gamma, describe(set.intervals())),
                        List.of(new SpecProposal(
                                SpecQuantity.GAMMA,
                                defaultGamma(set, GammaChoice.MarginOverMinimum.DEFAULT_FACTOR, new ArrayList<>()),
                                "the default choice: 1.2 x gamma_min, or the middle of the lowest interval when"
                                        + " that falls in a gap"))));
            }
        } else {
            if (set.isEmpty()) {
                throw noGamma(plant, desired, poles, set);
            }
            gamma = defaultGamma(set, ((GammaChoice.MarginOverMinimum) choice).factor(), notes);
        }
        notes.addAll(set.notes());
        double u = 1 / (gamma * gamma);
        PoleMatchedSolution solution = search.solutionAt(plant, desired, set, gamma);
        double[] margins = FeasibleGammaSearch.margins(plant, u, solution);
        for (int c = 0; c < conditions; c++) {
            if (!FeasibleGammaSearch.holds(c, margins[c], plant.order())) {
                throw new PoleMatchedRiccati.SystemFailure("the requirement '"
                        + condition(c, plant).meaning(index(c, plant)) + "' fails at the chosen gamma " + gamma
                        + " inside the checked feasible interval");
            }
        }
        double gammaMin = set.gammaMin();
        GammaInterval.GammaEnd binding = set.intervals().get(0).lowerBinding();
        double[] lowest = set.lowestHolding();
        List<GammaBound> list = new ArrayList<>(conditions);
        for (int c = 0; c < conditions; c++) {
            GammaCondition condition = condition(c, plant);
            int index = index(c, plant);
            list.add(new GammaBound(
                    condition,
                    index,
                    Math.min(lowest[c], gammaMin),
                    binding.condition() == condition && binding.stateIndex() == index,
                    OptionalDouble.empty()));
        }
        return new HighOrderDesign(
                plant, poles, solution, list, set.intervals(), gammaMin, gamma, set.evaluations(), notes);
    }

    /**
     * margin x gamma_min when it lies in the set; else (it falls in a gap above a bounded lowest interval) the
     * geometric middle of the lowest interval, with a note saying so.
     */
    static double defaultGamma(FeasibleGammaSearch.FeasibleGammaSet set, double margin, List<String> notes) {
        double gamma = margin * set.gammaMin();
        if (set.contains(gamma)) {
            return gamma;
        }
        GammaInterval lowest = set.intervals().get(0);
        double middle = Math.sqrt(lowest.lowerGamma() * lowest.upperGamma());
        notes.add(String.format(
                "%.6g x gamma_min = %.6g falls in a gap of the feasible gamma set %s; gamma is"
                        + " the geometric middle of the lowest interval instead",
                margin, gamma, describe(set.intervals())));
        return middle;
    }

    /** The intervals in words, e.g. (1.5, 2.25) and (3, infinity). */
    static String describe(List<GammaInterval> intervals) {
        if (intervals.isEmpty()) {
            return "(empty)";
        }
        StringBuilder text = new StringBuilder();
        for (int i = 0; i < intervals.size(); i++) {
            GammaInterval interval = intervals.get(i);
            if (i > 0) {
                text.append(i + 1 == intervals.size() ? " and " : ", ");
            }
            text.append(String.format(
                    "(%.6g, %s)",
                    interval.lowerGamma(),
                    interval.unbounded() ? "infinity" : String.format("%.6g", interval.upperGamma())));
        }
        return text.toString();
    }

    private InfeasibleDesignException noGamma(
            CompanionPlant plant, double[] desired, DesiredPoles poles, FeasibleGammaSearch.FeasibleGammaSet set) {
        boolean[] atInfinity = holds(plant, desired, 0);
        String failing = "";
        for (int c = 0; c < atInfinity.length; c++) {
            if (!atInfinity[c]) {
                failing = "; at gamma = infinity the requirement '"
                        + condition(c, plant).meaning(index(c, plant)) + "' fails";
                break;
            }
        }
        boolean lowDamping = poles.dominant().dampingRatio() < 1 / Math.sqrt(2);
        String searched = set.inputGain() > 0
                ? String.format(
                        " (searched from gamma = infinity down to the" + " closed-loop gain from w to u, %.6g)",
                        set.inputGain())
                : "";
        String reason = "no gamma meets every Riccati requirement for these closed-loop poles" + searched + failing
                + "; the "
                + (lowDamping
                        ? "dominant damping ratio "
                                + String.format("%.4g", poles.dominant().dampingRatio())
                                + " is below 1/sqrt(2): lower the overshoot"
                        : "requested poles are not reachable by this weighting: ask for faster settling or move"
                                + " the auxiliary poles");
        if (!set.notes().isEmpty()) {
            reason += " (" + String.join("; ", set.notes()) + ")";
        }
        return new InfeasibleDesignException(new Infeasibility(
                lowDamping ? SpecQuantity.OVERSHOOT_PERCENT : SpecQuantity.TIME_SPEC, reason, List.of()));
    }

    /**
     * Which requirements hold at u = 1/gamma^2 for the solution Newton reaches from a zero leading block (at
     * u = 0 the unique one): entries 0..n-1 are rho_i^2 &gt;= 0, n is P &gt; 0, n + 1 is stabilizing. A system
     * that cannot be solved fails every requirement.
     */
    public boolean[] holds(CompanionPlant plant, double[] desired, double inverseGammaSquared) {
        int n = plant.order();
        boolean[] result = new boolean[n + 2];
        PoleMatchedSolution solution;
        try {
            solution = new PoleMatchedRiccati().solve(plant, desired, inverseGammaSquared, false);
        } catch (PoleMatchedRiccati.SystemFailure | IllegalArgumentException e) {
            return result;
        }
        double[] w = solution.weightsSquared();
        for (int i = 0; i < n; i++) {
            result[i] = w[i] >= 0;
        }
        DMatrixRMaj p = solution.p();
        result[n] = smallestSymmetricEigenvalue(p) > 0;
        DMatrixRMaj worstCase = plant.stateMatrix();
        CommonOps_DDRM.multAdd(PoleMatchedRiccati.quadraticTerm(plant, inverseGammaSquared), p, worstCase);
        result[n + 1] = largestRealPart(worstCase) < 0;
        return result;
    }

    private static GammaCondition condition(int c, CompanionPlant plant) {
        return c < plant.order()
                ? GammaCondition.WEIGHT_REAL
                : c == plant.order() ? GammaCondition.P_POSITIVE_DEFINITE : GammaCondition.STABILIZING;
    }

    private static int index(int c, CompanionPlant plant) {
        return c < plant.order() ? c + 1 : 0;
    }

    static double smallestSymmetricEigenvalue(DMatrixRMaj symmetric) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(symmetric.numRows, false, true);
        if (!eig.decompose(symmetric.copy())) {
            return Double.NaN;
        }
        double min = Double.POSITIVE_INFINITY;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            min = Math.min(min, eig.getEigenvalue(i).real);
        }
        return min;
    }

    static double largestRealPart(DMatrixRMaj m) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(m.numRows, false);
        if (!eig.decompose(m.copy())) {
            return Double.NaN;
        }
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            Complex_F64 value = eig.getEigenvalue(i);
            max = Math.max(max, value.real);
        }
        return max;
    }

    static double norm(double[] v) {
        double s = 0;
        for (double x : v) {
            s = Math.hypot(s, x);
        }
        return s;
    }
}
