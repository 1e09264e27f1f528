package com.loopwright.solver.design;

import java.util.List;

/**
 * Independent checks of a closed-form design.
 *
 * @param closedFormResidual  relative Riccati residual of the closed-form P
 * @param numeric             the Hamiltonian solution of the same Riccati equation
 * @param relativeDifference  ||P_numeric - P_closed||_F / ||P_closed||_F
 * @param hinfNorm            closed-loop H-infinity norm from w to z
 * @param metrics             simulated step metrics
 * @param specChecks          each spec against its simulated value
 * @param certified           hinfNorm &lt;= gamma and the two Riccati solutions agree
 */
public record Verification(
        double closedFormResidual,
        RiccatiSolution numeric,
        double relativeDifference,
        HInfinityNorm hinfNorm,
        StepMetrics metrics,
        List<SpecCheck> specChecks,
        boolean certified) {

    public Verification {
        specChecks = List.copyOf(specChecks);
    }

    public boolean specsMet() {
        return specChecks.stream().allMatch(SpecCheck::met);
    }
}
