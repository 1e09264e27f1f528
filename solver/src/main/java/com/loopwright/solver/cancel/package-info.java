/**
 * Cooperative cancellation: the checkpoint long solver loops call once per pass, so that a computation whose
 * deadline has passed stops within one pass. Invariant: no state of its own; it reads the thread's interrupt.
 */
package com.loopwright.solver.cancel;
