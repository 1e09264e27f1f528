package com.loopwright.solver.highorder;

/**
 * The requirements on the pole-matched Riccati solution that limit gamma, and the two limits of the search that
 * can end an interval of the feasible gamma set.
 */
public enum HighOrderCondition {
    /** rho_i^2 &gt;= 0 for the state named by the bound's index. */
    WEIGHT_REAL(false, "state weight rho_%d is real"),
    /** P &gt; 0 (smallest eigenvalue positive). */
    P_POSITIVE_DEFINITE(true, "Riccati solution P is positive definite"),
    /** A + (B1B1'/gamma^2 - B2B2')P Hurwitz. */
    STABILIZING(true, "worst-case disturbance loop is stable (stabilizing solution)"),
    /**
     * gamma above the closed-loop gain from w to u, a necessary condition (the bounded real lemma: the design
     * certifies ||T_wz|| &lt; gamma and u is part of z).
     */
    INPUT_GAIN(true, "gamma exceeds the closed-loop gain from the disturbance to u"),
    /** The Riccati solution branch followed in 1/gamma^2 turns back (or stops converging) here. */
    SOLUTION_BRANCH_END(true, "the followed Riccati solution branch ends (turning point); smaller gamma on it"
            + " was not searched");

    private final boolean strict;
    private final String meaning;

    HighOrderCondition(boolean strict, String meaning) {
        this.strict = strict;
        this.meaning = meaning;
    }

    public boolean strict() {
        return strict;
    }

    /** What holds inside the bound; stateIndex is 1-based and only used by WEIGHT_REAL. */
    public String meaning(int stateIndex) {
        return String.format(meaning, stateIndex);
    }
}
