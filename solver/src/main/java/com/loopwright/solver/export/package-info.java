/**
 * The continuous design run by a controller: the sampled, clamped state-feedback law by emulation, its check
 * at the sample period, and its text as IEC 61131-3 Structured Text and C. Invariant: a law is emitted only
 * when the sampled loop is stable at the requested period and limit.
 */
package com.loopwright.solver.export;
