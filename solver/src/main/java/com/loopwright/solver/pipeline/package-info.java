/**
 * The solver's front door: one class per capability (two-state design, order-n design, robustness checks, model
 * fit, controller export, figure data) taking and returning records. It is the only solver package the api calls,
 * and every failure leaves it as one {@link com.loopwright.solver.pipeline.SolverFailure} with a kind.
 */
package com.loopwright.solver.pipeline;
