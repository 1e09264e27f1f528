/**
 * Closed-form design of the order-2 loop (pole matching, Riccati entries, gamma bounds, feasibility proposals) and
 * the gamma bound types shared with the order-n design in {@code highorder/}: {@link
 * com.loopwright.solver.design.GammaCondition} and {@link com.loopwright.solver.design.GammaBound}. It also holds
 * the result records of a designed loop that the front door ({@code pipeline/}) hands out, so the callers read
 * results from here and never from the machinery: the gains ({@code FeedbackGains}), the order-n design, its
 * verification, spec match and simulated step ({@code HighOrderDesign}, {@code HighOrderVerification},
 * {@code SpecMatch}, {@code HighOrderStep}, {@code GammaInterval}, {@code PoleMatchedSolution}), the order-2
 * verification ({@code Verification}, {@code SpecCheck}, {@code RiccatiSolution}, {@code HInfinityNorm}), step
 * metrics, grid metrics and trajectories ({@code StepMetrics}, {@code GridMetrics}, {@code DenseTrajectory},
 * {@code DisturbanceResponse}), the frequency response and margins ({@code BodeSeries}, {@code LoopMargins},
 * {@code FrequencyPoint}) and the
 * sampled law ({@code SampledLaw}).
 *
 * <p>Invariant: a requirement on the Riccati solution has one name for every order, and gamma_min is the largest
 * bound, which is the one flagged binding. The result records depend on plant and spec only, never on the
 * machinery that builds them (riccati, norm, simulation, loop, frequency, highorder, export).
 */
package com.loopwright.solver.design;
