package com.loopwright.solver.design;

import java.util.List;

/**
 * The requirements on the Riccati solution that each put a lower bound on gamma, for the closed-form design of
 * order 2 and the pole-matched design of order n, and the two limits of the order-n search that can end an interval
 * of the feasible gamma set. One type for both orders: P &gt; 0 is the same requirement in each.
 *
 * <p>Order 2: with k = b^2 - d^2/gamma^2 each requirement reads d^2/gamma^2 &lt;= D (or &lt; D), so
 * gamma &gt;= d/sqrt(D), and none can hold at any gamma if D &lt;= 0 ({@link #CLOSED_FORM}, in this order).
 */
public enum GammaCondition {
    /** Order 2: rho1^2 = 2 a0 p12 + k p12^2 &gt;= 0: D = b^2 + 2 a0/p12. */
    POSITION_WEIGHT_REAL(false, false, "position weight rho1 is real"),
    /** Order 2: rho2^2 = 2 a1 p22 - 2 p12 + k p22^2 &gt;= 0: D = b^2 - (2 p12 - 2 a1 p22)/p22^2. */
    VELOCITY_WEIGHT_REAL(false, false, "velocity weight rho2 is real"),
    /** Order 2: p11 = a1 p12 + a0 p22 + k p12 p22 &gt; 0: D = b^2 + (a1 p12 + a0 p22)/(p12 p22). */
    P11_POSITIVE(true, false, "Riccati entry p11 is positive"),
    /**
     * Any order: P &gt; 0 (smallest eigenvalue positive); order 2: det P &gt; 0,
     * D = b^2 - (p12^2 - a1 p12 p22 - a0 p22^2)/(p12 p22^2).
     */
    P_POSITIVE_DEFINITE(true, false, "Riccati solution P is positive definite"),
    /** Order 2: a1 + k p22 &gt; 0 (trace of A + (B1B1'/gamma^2 - B2B2')P negative): D = b^2 + a1/p22. */
    STABILIZING_DAMPING(true, false, "worst-case disturbance loop is damped (stabilizing solution, trace)"),
    /** Order 2: a0 + k p12 &gt; 0 (its determinant positive): D = b^2 + a0/p12. */
    STABILIZING_STIFFNESS(true, false, "worst-case disturbance loop is stiff (stabilizing solution, determinant)"),
    /** Order n: rho_i^2 &gt;= 0 for the state named by the bound's index. */
    WEIGHT_REAL(false, true, "state weight rho_%d is real"),
    /** Order n: A + (B1B1'/gamma^2 - B2B2')P Hurwitz. */
    STABILIZING(true, false, "worst-case disturbance loop is stable (stabilizing solution)"),
    /**
     * Order n: gamma above the closed-loop gain from w to u, a necessary condition (the bounded real lemma: the
     * design certifies ||T_wz|| &lt; gamma and u is part of z).
     */
    INPUT_GAIN(true, false, "gamma exceeds the closed-loop gain from the disturbance to u"),
    /** Order n: the Riccati solution branch followed in 1/gamma^2 turns back (or stops converging) here. */
    SOLUTION_BRANCH_END(
            true,
            false,
            "the followed Riccati solution branch ends (turning point); smaller gamma on it" + " was not searched");

    /** The six requirements of the closed-form order-2 design, in the order they are reported. */
    public static final List<GammaCondition> CLOSED_FORM = List.of(
            POSITION_WEIGHT_REAL,
            VELOCITY_WEIGHT_REAL,
            P11_POSITIVE,
            P_POSITIVE_DEFINITE,
            STABILIZING_DAMPING,
            STABILIZING_STIFFNESS);

    private final boolean strict;
    private final boolean perState;
    private final String meaning;

    GammaCondition(boolean strict, boolean perState, String meaning) {
        this.strict = strict;
        this.perState = perState;
        this.meaning = meaning;
    }

    /** True when the condition is a strict inequality (it fails at equality). */
    public boolean strict() {
        return strict;
    }

    /** What holds above the bound, in engineering words, for a condition that names no state. */
    public String meaning() {
        if (perState) {
            throw new IllegalStateException(name() + " names a state: use meaning(stateIndex)");
        }
        return meaning;
    }

    /** What holds inside the bound; stateIndex is 1-based and only used by {@link #WEIGHT_REAL}. */
    public String meaning(int stateIndex) {
        return perState ? String.format(meaning, stateIndex) : meaning;
    }
}
