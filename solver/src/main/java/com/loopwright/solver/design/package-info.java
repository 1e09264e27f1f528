/**
 * Closed-form design of the order-2 loop (pole matching, Riccati entries, gamma bounds, feasibility proposals) and
 * the gamma bound types shared with the order-n design in {@code highorder/}: {@link
 * com.loopwright.solver.design.GammaCondition} and {@link com.loopwright.solver.design.GammaBound}.
 *
 * <p>Invariant: a requirement on the Riccati solution has one name for every order, and gamma_min is the largest
 * bound, which is the one flagged binding.
 */
package com.loopwright.solver.design;
