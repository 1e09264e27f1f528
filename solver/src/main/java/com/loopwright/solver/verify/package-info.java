/**
 * Independent checks of a closed-form two-state design: the Riccati residual of the closed-form P, the numeric
 * Riccati solution, the closed-loop H-infinity norm against gamma and the simulated step metrics against the
 * specs. Invariant: a design is reported certified only when every independent route agrees.
 */
package com.loopwright.solver.verify;
