/**
 * The numeric algebraic Riccati solver for any order, A'P + PA + PRP + Q = 0, by the matrix sign function of the
 * Hamiltonian, with residual refinement. It is the independent route every closed-form P is checked against.
 * Invariant: a returned solution is stabilizing and carries its relative residual; otherwise the solver throws.
 * The solution record is a design result record ({@code design.RiccatiSolution}).
 */
package com.loopwright.solver.riccati;
