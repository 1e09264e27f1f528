/**
 * H-infinity norms of stable transfer matrices: the Hamiltonian eigenvalue test for any order (with balancing
 * of the state) and the exact peak gain of a two-state, single-input system. Invariant: the reported norm is
 * the certified upper end of the bracket, never an underestimate, together with its relative tolerance. The norm
 * record itself is a design result record ({@code design.HInfinityNorm}).
 */
package com.loopwright.solver.norm;
