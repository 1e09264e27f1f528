/**
 * The plant to control: the canonical second-order form x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w, and the
 * physical descriptions that reduce to it (rotary axis, mass-spring-damper, second-order transfer function,
 * two-state model by a similarity transform). Invariant: every description reduces to one canonical plant with
 * finite coefficients and b != 0, or is refused with the reason in engineering words.
 */
package com.loopwright.solver.plant;
