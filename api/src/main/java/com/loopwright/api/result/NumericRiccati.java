package com.loopwright.api.result;

import java.util.List;

/**
 * The independent numeric solution of the Riccati equation (Hamiltonian matrix sign function).
 *
 * @param p                  P_numeric, rows
 * @param residualNorm       its relative residual in the Riccati equation
 * @param relativeDifference ||P_numeric - P||_F / ||P||_F (order n: over ||P_numeric||_F)
 * @param iterations         matrix-sign iterations used
 */
public record NumericRiccati(List<List<Double>> p, double residualNorm, double relativeDifference, int iterations) {
    public NumericRiccati {
        p = Matrices.copy(p);
    }
}
