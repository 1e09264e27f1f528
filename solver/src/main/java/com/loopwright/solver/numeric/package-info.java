/**
 * Small numeric tools shared by the solver: the one bracketed root finder and safe-side rounding of printed bounds.
 *
 * <p>Invariant: every iteration here has a named cap and returns a value inside its bracket; a root finder change
 * is an answer change (the responses print doubles in full).
 */
package com.loopwright.solver.numeric;
