/**
 * What people take away from a design: one endpoint per figure (SVG) and per controller format (Structured Text,
 * C, JSON parameters), each wrapping a design request under "design". Figure data and the sampled law come from
 * solver.pipeline; this package only checks requests, draws and writes.
 */
package com.loopwright.api.takeaway;
