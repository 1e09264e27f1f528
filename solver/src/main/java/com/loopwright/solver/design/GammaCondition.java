package com.loopwright.solver.design;

/**
 * The requirements on the Riccati solution that each put a lower bound on gamma. With k = b^2 - d^2/gamma^2
 * each reads d^2/gamma^2 &lt;= D (or &lt; D), so gamma &gt;= d/sqrt(D), and none can hold at any gamma if D &lt;= 0.
 */
public enum GammaCondition {
    /** rho1^2 = 2 a0 p12 + k p12^2 &gt;= 0: D = b^2 + 2 a0/p12. */
    POSITION_WEIGHT_REAL(false, "position weight rho1 is real"),
    /** rho2^2 = 2 a1 p22 - 2 p12 + k p22^2 &gt;= 0: D = b^2 - (2 p12 - 2 a1 p22)/p22^2. */
    VELOCITY_WEIGHT_REAL(false, "velocity weight rho2 is real"),
    /** p11 = a1 p12 + a0 p22 + k p12 p22 &gt; 0: D = b^2 + (a1 p12 + a0 p22)/(p12 p22). */
    P11_POSITIVE(true, "Riccati entry p11 is positive"),
    /** det P &gt; 0: D = b^2 - (p12^2 - a1 p12 p22 - a0 p22^2)/(p12 p22^2). */
    P_POSITIVE_DEFINITE(true, "Riccati solution P is positive definite"),
    /** a1 + k p22 &gt; 0 (trace of A + (B1B1'/gamma^2 - B2B2')P negative): D = b^2 + a1/p22. */
    STABILIZING_DAMPING(true, "worst-case disturbance loop is damped (stabilizing solution, trace)"),
    /** a0 + k p12 &gt; 0 (its determinant positive): D = b^2 + a0/p12. */
    STABILIZING_STIFFNESS(true, "worst-case disturbance loop is stiff (stabilizing solution, determinant)");

    private final boolean strict;
    private final String meaning;

    GammaCondition(boolean strict, String meaning) {
        this.strict = strict;
        this.meaning = meaning;
    }

    /** True when the condition is a strict inequality (it fails at equality). */
    public boolean strict() {
        return strict;
    }

    /** What holds above the bound, in engineering words. */
    public String meaning() {
        return meaning;
    }
}
