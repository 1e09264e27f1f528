/**
 * Step-test identification: a second-order model y0 + K S(wn (t - t0); zeta) fitted by Levenberg-Marquardt
 * (Hipparchus), with standard errors, confidence intervals and warnings about what the data cannot determine.
 * The step test, the options and the fitted model are plant records ({@code plant.StepTestData},
 * {@code plant.FitOptions}, {@code plant.StepFit}). Invariant: every iteration is capped, and a fit that does not converge is refused, never returned.
 */
package com.loopwright.solver.fit;
