/**
 * The numeric algebraic Riccati solver for any order, A'P + PA + PRP + Q = 0, by the matrix sign function of the
 * Hamiltonian, with residual refinement. It is the independent route every closed-form P is checked against.
 * Invariant: a returned solution is stabilizing and carries its relative residual; otherwise the solver throws.
 */
package com.loopwright.solver.riccati;
