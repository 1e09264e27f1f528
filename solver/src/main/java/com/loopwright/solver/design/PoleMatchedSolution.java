package com.loopwright.solver.design;

import org.ejml.data.DMatrixRMaj;

/**
 * The pole-matched Riccati solution of an order-n design for one gamma.
 *
 * @param p                     P, n x n, symmetric (copied)
 * @param weightsSquared        rho_i^2, i = 1..n (may be negative below gamma_min)
 * @param relativeResidual      the relative Riccati residual (riccati.RiccatiResidual#relative) of P with these weights
 * @param reciprocalCondition   sigma_min/sigma_max of the column-scaled linear system
 * @param newtonSteps           Newton steps taken after the first solve
 */
public record PoleMatchedSolution(
        DMatrixRMaj p, double[] weightsSquared, double relativeResidual, double reciprocalCondition, int newtonSteps) {
    public PoleMatchedSolution {
        p = p.copy();
        weightsSquared = weightsSquared.clone();
    }

    @Override
    public DMatrixRMaj p() {
        return p.copy();
    }

    @Override
    public double[] weightsSquared() {
        return weightsSquared.clone();
    }
}
