package com.loopwright.solver.design;

/**
 * One interval of the feasible gamma set: every gamma strictly between the ends completes the design.
 *
 * @param lowerGamma     the lower end [w-to-z gain], positive
 * @param upperGamma     the upper end; {@code Double.POSITIVE_INFINITY} when unbounded (never sent as a number)
 * @param lowerBinding   the requirement that fails just below the lower end
 * @param upperBinding   the requirement that fails just above the upper end; null when unbounded
 */
public record GammaInterval(double lowerGamma, double upperGamma, GammaEnd lowerBinding, GammaEnd upperBinding) {

    public GammaInterval {
        if (!(lowerGamma > 0) || !(upperGamma > lowerGamma)) {
            throw new IllegalArgumentException("need 0 < lower < upper, got " + lowerGamma + ", " + upperGamma);
        }
        if ((upperBinding == null) != unbounded(upperGamma)) {
            throw new IllegalArgumentException("an upper binding exactly when the upper end is finite");
        }
    }

    public boolean unbounded() {
        return unbounded(upperGamma);
    }

    /** Strictly inside. */
    public boolean contains(double gamma) {
        return gamma > lowerGamma && gamma < upperGamma;
    }

    private static boolean unbounded(double upper) {
        return upper == Double.POSITIVE_INFINITY;
    }

    /**
     * What ends the interval.
     *
     * @param condition  the requirement
     * @param stateIndex 1-based state for {@link GammaCondition#WEIGHT_REAL}, 0 otherwise
     */
    public record GammaEnd(GammaCondition condition, int stateIndex) {
        public String meaning() {
            return condition.meaning(stateIndex);
        }
    }
}
