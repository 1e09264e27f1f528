package com.loopwright.solver.highorder;

/** The requirements on the pole-matched Riccati solution that put lower bounds on gamma. */
public enum HighOrderCondition {
    /** rho_i^2 &gt;= 0 for the state named by the bound's index. */
    WEIGHT_REAL(false, "state weight rho_%d is real"),
    /** P &gt; 0 (smallest eigenvalue positive). */
    P_POSITIVE_DEFINITE(true, "Riccati solution P is positive definite"),
    /** A + (B1B1'/gamma^2 - B2B2')P Hurwitz. */
    STABILIZING(true, "worst-case disturbance loop is stable (stabilizing solution)");

    private final boolean strict;
    private final String meaning;

    HighOrderCondition(boolean strict, String meaning) {
        this.strict = strict;
        this.meaning = meaning;
    }

    public boolean strict() {
        return strict;
    }

    /** What holds above the bound; stateIndex is 1-based and only used by WEIGHT_REAL. */
    public String meaning(int stateIndex) {
        return String.format(meaning, stateIndex);
    }
}
