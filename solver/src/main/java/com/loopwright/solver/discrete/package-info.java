/**
 * The generic discrete controller that every export (Structured Text, C, PLCopen XML, parameter set) writes out:
 * controller state q (observer states and/or one integrator, possibly empty), setpoint r and measured vector y
 * in, one command u out, with the continuous-time design discretized exactly for the task period (zero-order
 * hold), and the reference step ({@link com.loopwright.solver.discrete.ControllerStep}) and closed-loop
 * simulation ({@link com.loopwright.solver.discrete.ClosedLoopSimulator}) the exported code is checked against.
 *
 * <p>Invariant: one {@link com.loopwright.solver.discrete.DiscreteController} plus one
 * {@link com.loopwright.solver.discrete.ControllerSettings} define the sample-by-sample behaviour; the Java step
 * and every writer evaluate the same expressions in the same order.
 */
package com.loopwright.solver.discrete;
