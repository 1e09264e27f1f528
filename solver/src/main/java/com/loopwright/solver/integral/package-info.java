/**
 * Integral action on the tracking error: the plant augmented with xi' = r - y (for the canonical plant the order-3
 * companion plant with denominator [0, a0, a1] in z = [-xi, x1, x2]), designed by the order-n pole-matched
 * machinery of {@code highorder/}, with the two-degree-of-freedom reference gain whose zero cancels the integral
 * pole, and the load-step figures (steady offset by the final-value theorem, recovery time) of any closed loop.
 * Results are {@code design/} records ({@code TrackingLaw}, {@code LoadStepResponse}).
 */
package com.loopwright.solver.integral;
