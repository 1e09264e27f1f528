/**
 * The sampled state-feedback law for the controller: its design at a sample period, its simulation on the exact
 * sampled plant ({@link com.loopwright.solver.export.SampledLawSimulator}) and its text as IEC 61131-3 Structured
 * Text, C and a parameter set.
 *
 * <p>Invariant: one {@link com.loopwright.solver.design.SampledLaw} record carries the gains, clamp and period that
 * the simulation and every exported text use.
 */
package com.loopwright.solver.export;
