/**
 * Small dense linear algebra the solver needs beyond EJML: the matrix exponential and the closed-form spectrum
 * of 2 x 2 matrices. Invariant: pure functions of their inputs, no state.
 */
package com.loopwright.solver.linalg;
