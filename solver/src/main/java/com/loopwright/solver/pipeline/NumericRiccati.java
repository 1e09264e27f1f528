package com.loopwright.solver.pipeline;

/**
 * The numeric (Hamiltonian) solution of the order-2 Riccati equation that cross-checks the closed-form P, as plain
 * numbers: P is symmetric 2 x 2, so its three entries are the whole matrix.
 *
 * @param p11                P(1,1) of the numeric solution
 * @param p12                P(1,2) = P(2,1)
 * @param p22                P(2,2)
 * @param relativeResidual   relative Riccati residual of the numeric P
 * @param relativeDifference ||P_numeric - P_closed||_F / ||P_closed||_F
 * @param iterations         matrix-sign-function Newton iterations taken
 */
public record NumericRiccati(
        double p11, double p12, double p22, double relativeResidual, double relativeDifference, int iterations) {}
