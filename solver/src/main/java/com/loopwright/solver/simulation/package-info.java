/**
 * Time-domain simulation: the exact zero-order-hold step of linear loops with streaming, event-refined step metrics
 * ({@link com.loopwright.solver.simulation.StepSimulator}), and the dense-grid simulators of the pre-commissioning
 * checks (saturated actuator, held disturbance, sampled controller with input delay). The records they return
 * (step metrics, grid metrics, dense trajectories) live in {@code design/}, the disturbance shapes in {@code plant/}.
 *
 * <p>Invariant: every state update is an exact matrix-exponential hold of a constant input (no numerical
 * integration), every simulated grid has a named cap, and a diverging state is reported, never returned as
 * Infinity or NaN.
 */
package com.loopwright.solver.simulation;
