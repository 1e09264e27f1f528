package com.loopwright.solver.robustness;

/** The outcome of judging one check: met, not met, or not judged (no limit given, no gamma known, no crossover). */
public enum Verdict {
    MET,
    NOT_MET,
    NOT_JUDGED;

    /** MET when the condition holds, else NOT_MET. */
    public static Verdict of(boolean met) {
        return met ? MET : NOT_MET;
    }

    /**
     * A simulated step against the acceptance limits: not judged when no limit is given; a step without metrics (the
     * simulation diverged) fails every given limit.
     */
    static Verdict ofStep(AcceptanceLimits limits, Double settlingTime, Double riseTime, double overshoot) {
        return limits.judges() ? of(limits.met(settlingTime, riseTime, overshoot)) : NOT_JUDGED;
    }

    static Verdict ofStep(AcceptanceLimits limits, com.loopwright.solver.design.GridMetrics metrics) {
        if (metrics == null) {
            return limits.judges() ? NOT_MET : NOT_JUDGED;
        }
        return ofStep(limits, metrics.settlingTimeSeconds(), metrics.riseTimeSeconds(), metrics.overshootPercent());
    }

    /** True only for NOT_MET: a check that was not judged does not fail. */
    public boolean failed() {
        return this == NOT_MET;
    }
}
