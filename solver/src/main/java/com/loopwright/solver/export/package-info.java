/**
 * The controller export. The sampled state-feedback law: its check at a sample period
 * ({@link com.loopwright.solver.export.SampledLawDesigner}) and its simulation on the exact sampled plant
 * ({@link com.loopwright.solver.export.SampledLawSimulator}). The generic discrete controller
 * ({@link com.loopwright.solver.discrete.DiscreteController}: plain law, integral action, observer) as a
 * prefix-named Structured Text function block ({@link com.loopwright.solver.export.ControllerStructuredTextWriter}),
 * a C header and source pair ({@link com.loopwright.solver.export.ControllerCWriter}) and a PLCopen TC6 XML 2.01
 * project ({@link com.loopwright.solver.export.PlcOpenXmlWriter}), in LREAL/double or REAL/float, under one
 * {@link com.loopwright.solver.export.ProvenanceHeader}.
 *
 * <p>Invariants: one {@link com.loopwright.solver.design.SampledLaw} record carries the gains, clamp and period that
 * the simulation and the exported plain law use; the texts are all written from one statement
 * list ({@code ControllerBody}) in the order of {@link com.loopwright.solver.discrete.ControllerStep}, so the
 * double exports reproduce the service's simulation to rounding.
 */
package com.loopwright.solver.export;
