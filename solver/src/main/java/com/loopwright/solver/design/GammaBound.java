package com.loopwright.solver.design;

/**
 * One lower bound on gamma.
 *
 * @param condition        the requirement behind it
 * @param headroom         D: the requirement is d^2/gamma^2 &lt;= D; it can hold only if D &gt; 0
 * @param gammaLowerBound  d/sqrt(D) [w-to-z gain], 0 when d = 0; only meaningful when {@link #satisfiable()}
 */
public record GammaBound(GammaCondition condition, double headroom, double gammaLowerBound) {

    /** True when some gamma meets this condition. */
    public boolean satisfiable() {
        return headroom > 0 || (headroom == 0 && gammaLowerBound == 0 && !condition.strict());
    }
}
