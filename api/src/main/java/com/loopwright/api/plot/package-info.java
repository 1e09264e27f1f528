/**
 * SVG figures of a design (step response with its spec envelope, control effort, Bode with margins, the
 * uncertainty band). Invariant: drawing only; every number drawn was computed by the solver.
 */
package com.loopwright.api.plot;
