package com.loopwright.solver.design;

import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.DesiredPoles;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * A pole-matched H-infinity state-feedback design of order n, in companion coordinates z.
 * The law is u = kr r - K z with K = B2'P = b (row n of P).
 *
 * @param plant       the companion plant
 * @param poles       the requested closed-loop poles
 * @param solution    P and rho_i^2 at gamma, from the pole-matched Riccati system
 * @param gammaBounds one bound per requirement
 * @param feasibleSet the feasible gamma set, disjoint intervals in increasing order
 * @param gammaMin    its infimum
 * @param gamma       the chosen gamma, inside the set
 * @param bisectionSteps Newton solves spent on the feasible set (continuation, refinement of the ends, checks)
 * @param notes       how gamma was chosen when not by the plain rule, intervals left out, other branches
 */
public record HighOrderDesign(
        CompanionPlant plant,
        DesiredPoles poles,
        PoleMatchedSolution solution,
        List<GammaBound> gammaBounds,
        List<GammaInterval> feasibleSet,
        double gammaMin,
        double gamma,
        int bisectionSteps,
        List<String> notes) {

    public HighOrderDesign {
        gammaBounds = List.copyOf(gammaBounds);
        feasibleSet = List.copyOf(feasibleSet);
        notes = List.copyOf(notes);
    }

    /** K = b (last row of P), in companion coordinates. */
    public double[] gain() {
        DMatrixRMaj p = solution.p();
        int n = plant.order();
        double[] k = new double[n];
        for (int j = 0; j < n; j++) {
            k[j] = plant.b() * p.get(n - 1, j);
        }
        return k;
    }

    /** kr = alpha_0/(b c_0): unit DC gain from r to y (c_0 != 0 is required). */
    public double referenceGain() {
        return poles.coefficients()[0] / (plant.b() * plant.numerator()[0]);
    }

    /** rho_i = sqrt(max(rho_i^2, 0)); above gamma_min every square is >= 0 up to rounding. */
    public double[] weights() {
        double[] squared = solution.weightsSquared();
        double[] rho = new double[squared.length];
        for (int i = 0; i < rho.length; i++) {
            rho[i] = Math.sqrt(Math.max(squared[i], 0));
        }
        return rho;
    }

    /** Convenience for callers that keep the gamma choice. */
    public static boolean fixedGamma(GammaChoice choice) {
        return choice instanceof GammaChoice.Fixed;
    }
}
