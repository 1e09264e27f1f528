package com.loopwright.solver.design;

/**
 * Independent checks of a high-order design.
 *
 * @param numeric              the Hamiltonian (matrix sign function) solution of the same Riccati equation
 * @param relativeDifference   ||P_numeric - P||_F / ||P_numeric||_F
 * @param norm                 closed-loop H-infinity norm from w to z = [rho_1 z_1 .. rho_n z_n, u]
 * @param step                 the simulated step of the actual closed loop (zeros included)
 * @param certified            norm &lt;= gamma (with rounding slack) and the two solutions agree
 */
public record HighOrderVerification(
        RiccatiSolution numeric,
        double relativeDifference,
        HInfinityNorm norm,
        HighOrderStep step,
        boolean certified) {}
