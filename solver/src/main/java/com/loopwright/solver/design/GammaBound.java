package com.loopwright.solver.design;

import java.util.OptionalDouble;

/**
 * One requirement's lower bound on gamma, for the closed-form design of order 2 and the design of order n. For
 * order n the requirements need not be monotone in gamma: the bound says where the requirement stops holding for
 * good as gamma decreases on the followed solution branches, not that it holds at every gamma above.
 *
 * @param condition       the requirement
 * @param stateIndex      1-based state index for {@link GammaCondition#WEIGHT_REAL}, 0 otherwise
 * @param gammaLowerBound the smallest gamma at which the requirement holds [w-to-z gain]; order 2: d/sqrt(D), 0 when
 *                        d = 0, only meaningful when {@link #satisfiable()}
 * @param binding         true when this requirement ends the feasible set at gamma_min
 * @param headroom        order 2 only: D, the requirement is d^2/gamma^2 &lt;= D and can hold only if D &gt; 0
 */
public record GammaBound(
        GammaCondition condition, int stateIndex, double gammaLowerBound, boolean binding, OptionalDouble headroom) {

    /** An order-2 bound. */
    public static GammaBound closedForm(
            GammaCondition condition, double headroom, double gammaLowerBound, boolean binding) {
        return new GammaBound(condition, 0, gammaLowerBound, binding, OptionalDouble.of(headroom));
    }

    /** True when some gamma meets this condition (order 2; an order-n bound is found where it holds). */
    public boolean satisfiable() {
        if (headroom.isEmpty()) {
            return true;
        }
        double d = headroom.getAsDouble();
        return d > 0 || (d == 0 && gammaLowerBound == 0 && !condition.strict());
    }

    public String meaning() {
        return condition.meaning(stateIndex);
    }
}
