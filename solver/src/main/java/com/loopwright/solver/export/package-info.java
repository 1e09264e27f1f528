/**
 * The controller export. Today's sampled state-feedback law: its design at a sample period, its simulation on the
 * exact sampled plant ({@link com.loopwright.solver.export.SampledLawSimulator}) and its text as IEC 61131-3
 * Structured Text, C and a parameter set. The generic discrete controller
 * ({@link com.loopwright.solver.discrete.DiscreteController}: plain law, integral action, observer) as a
 * prefix-named Structured Text function block ({@link com.loopwright.solver.export.ControllerStructuredTextWriter}),
 * a C header and source pair ({@link com.loopwright.solver.export.ControllerCWriter}) and a PLCopen TC6 XML 2.01
 * project ({@link com.loopwright.solver.export.PlcOpenXmlWriter}), in LREAL/double or REAL/float, under one
 * {@link com.loopwright.solver.export.ProvenanceHeader}.
 *
 * <p>Invariants: one {@link com.loopwright.solver.design.SampledLaw} record carries the gains, clamp and period that
 * the simulation and every exported text of the plain law use; the generic texts are all written from one statement
 * list ({@code ControllerBody}) in the order of {@link com.loopwright.solver.discrete.ControllerStep}, so the
 * double exports reproduce the service's simulation to rounding.
 */
package com.loopwright.solver.export;
