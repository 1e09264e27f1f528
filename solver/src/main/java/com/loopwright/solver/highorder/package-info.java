/**
 * Companion-form design for orders 2 to 8: the pole-matched Riccati system, the feasible gamma set searched along
 * solution branches, spec matching and verification. The companion plant is a plant record, the desired poles
 * spec records, and the results design records ({@code design.HighOrderDesign} and its kin). Gamma requirements and bounds use the types of {@code design/}
 * ({@link com.loopwright.solver.design.GammaCondition}, {@link com.loopwright.solver.design.GammaBound}).
 *
 * <p>Invariant: every gamma in a reported interval of the feasible set completes the design, checked at the end
 * points and inside.
 */
package com.loopwright.solver.highorder;
