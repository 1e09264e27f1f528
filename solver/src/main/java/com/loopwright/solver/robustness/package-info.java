/**
 * Pre-commissioning checks of a designed loop and their report records: uncertainty corners and Monte Carlo, the
 * step envelope, disturbance rejection, actuator saturation, sampling and delay, loop margins. The checks read the
 * loop from {@code loop/}, simulate with {@code simulation/} and take margins from {@code frequency/}.
 *
 * <p>Invariant: a check only reads and reports; the reports are immutable records with every list capped.
 */
package com.loopwright.solver.robustness;
