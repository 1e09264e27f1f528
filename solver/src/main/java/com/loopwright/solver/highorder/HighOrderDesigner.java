package com.loopwright.solver.highorder;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.Infeasibility;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.design.SpecProposal;
import com.loopwright.solver.design.SpecQuantity;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * Pole-matched H-infinity design of order n: for each requirement (rho_i^2 &gt;= 0, P &gt; 0, stabilizing) the
 * smallest gamma above which it holds is found by bisection on u = 1/gamma^2 from u = 0 (gamma = infinity),
 * where every requirement must hold for a design to exist. The bisection takes each requirement, once lost as
 * gamma decreases, to stay lost (true in closed form for n = 2); the chosen gamma is checked again directly.
 */
public final class HighOrderDesigner {

    /** Cap on the doublings or halvings of u that bracket one bound. */
    public static final int MAX_BRACKET_STEPS = 200;
    /** Cap on the bisection steps of one bound (the bracket shrinks to rounding well before). */
    public static final int MAX_BISECTION_STEPS = 200;
    /** Bounds within this relative distance of gamma_min are reported as binding. */
    static final double BINDING_TOLERANCE = 1e-9;
    /** The scan starts at u = (|B1|/b)^2 / 2^this, i.e. gamma 2^20 above the disturbance-to-input ratio. */
    static final int SCAN_OCTAVES_BELOW = 40;
    /** Bisection stops when the bracket on u is this narrow, relative. */
    static final double BISECTION_RELATIVE_WIDTH = 1e-15;

    private final PoleMatchedRiccati riccati = new PoleMatchedRiccati();

    public HighOrderDesign design(CompanionPlant plant, DesiredPoles poles, GammaChoice choice) {
        if (poles.order() != plant.order()) {
            throw new IllegalArgumentException("need " + plant.order() + " poles, got " + poles.order());
        }
        double[] desired = poles.coefficients();
        int conditions = plant.order() + 2;
        boolean[] atInfinity = holds(plant, desired, 0);
        for (int c = 0; c < conditions; c++) {
            if (!atInfinity[c]) {
                String reason = "no gamma meets the requirement '" + condition(c, plant).meaning(index(c, plant))
                        + "' for these closed-loop poles, not even gamma = infinity; the "
                        + (poles.dominant().dampingRatio() < 1 / Math.sqrt(2)
                        ? "dominant damping ratio " + String.format("%.4g", poles.dominant().dampingRatio())
                        + " is below 1/sqrt(2): lower the overshoot"
                        : "requested poles are not reachable by this weighting: ask for faster settling or move"
                        + " the auxiliary poles");
                throw new InfeasibleDesignException(new Infeasibility(
                        poles.dominant().dampingRatio() < 1 / Math.sqrt(2) ? SpecQuantity.OVERSHOOT_PERCENT
                                : SpecQuantity.TIME_SPEC, reason, List.of()));
            }
        }
        double[] bounds = new double[conditions];
        int steps = 0;
        // Scan u = 1/gamma^2 upward on a geometric grid from far above gamma's scale down to the first failure of
        // each requirement, then bisect that bracket.
        double scale = Math.pow(norm(plant.disturbance()) / plant.b(), 2);
        double[] lastHold = new double[conditions];
        double[] firstFail = new double[conditions];
        java.util.Arrays.fill(firstFail, Double.POSITIVE_INFINITY);
        double probe = scale * Math.pow(2, -SCAN_OCTAVES_BELOW);
        int open = conditions;
        for (int i = 0; i < MAX_BRACKET_STEPS && open > 0 && Double.isFinite(probe); i++, probe *= 2) {
            boolean[] h = holds(plant, desired, probe);
            steps++;
            for (int c = 0; c < conditions; c++) {
                if (firstFail[c] == Double.POSITIVE_INFINITY) {
                    if (h[c]) {
                        lastHold[c] = probe;
                    } else {
                        firstFail[c] = probe;
                        open--;
                    }
                }
            }
        }
        for (int c = 0; c < conditions; c++) {
            if (firstFail[c] == Double.POSITIVE_INFINITY) {
                bounds[c] = 0;
                continue;
            }
            double lo = lastHold[c];
            double hi = firstFail[c];
            for (int i = 0; i < MAX_BISECTION_STEPS && hi - lo > BISECTION_RELATIVE_WIDTH * hi; i++) {
                double mid = 0.5 * (lo + hi);
                if (holds(plant, desired, mid)[c]) {
                    lo = mid;
                } else {
                    hi = mid;
                }
                steps++;
            }
            bounds[c] = 1 / Math.sqrt(0.5 * (lo + hi));
        }
        double gammaMin = 0;
        for (double bound : bounds) {
            gammaMin = Math.max(gammaMin, bound);
        }
        List<HighOrderGammaBound> list = new ArrayList<>(conditions);
        for (int c = 0; c < conditions; c++) {
            list.add(new HighOrderGammaBound(condition(c, plant), index(c, plant), bounds[c],
                    bounds[c] >= gammaMin * (1 - BINDING_TOLERANCE)));
        }
        double gamma;
        if (choice instanceof GammaChoice.Fixed fixed) {
            gamma = fixed.gamma();
            if (!(gamma > gammaMin)) {
                throw new InfeasibleDesignException(new Infeasibility(SpecQuantity.GAMMA, String.format(
                        "gamma %.6g is not above gamma_min %.6g: some Riccati requirement fails at this gamma",
                        gamma, gammaMin), List.of(new SpecProposal(SpecQuantity.GAMMA,
                        gammaMin * GammaChoice.MarginOverMinimum.DEFAULT_FACTOR,
                        "the default margin of 1.2 over gamma_min"))));
            }
        } else {
            gamma = gammaMin * ((GammaChoice.MarginOverMinimum) choice).factor();
        }
        double u = gamma > 0 ? 1 / (gamma * gamma) : 0;
        boolean[] atGamma = holds(plant, desired, u);
        for (int c = 0; c < conditions; c++) {
            if (!atGamma[c]) {
                throw new PoleMatchedRiccati.SystemFailure("the requirement '" + condition(c, plant).meaning(index(c, plant))
                        + "' fails at the chosen gamma " + gamma + " although its bisected bound is "
                        + bounds[c] + ": the requirement is not monotone in gamma here");
            }
        }
        return new HighOrderDesign(plant, poles, riccati.solve(plant, desired, u), list, gammaMin, gamma, steps);
    }

    /**
     * Which requirements hold at u = 1/gamma^2: entries 0..n-1 are rho_i^2 &gt;= 0, n is P &gt; 0, n + 1 is
     * stabilizing. A system that cannot be solved fails every requirement.
     */
    public boolean[] holds(CompanionPlant plant, double[] desired, double inverseGammaSquared) {
        int n = plant.order();
        boolean[] result = new boolean[n + 2];
        PoleMatchedRiccati.Solution solution;
        try {
            solution = riccati.solve(plant, desired, inverseGammaSquared, false);
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

    private static HighOrderCondition condition(int c, CompanionPlant plant) {
        return c < plant.order() ? HighOrderCondition.WEIGHT_REAL
                : c == plant.order() ? HighOrderCondition.P_POSITIVE_DEFINITE : HighOrderCondition.STABILIZING;
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
