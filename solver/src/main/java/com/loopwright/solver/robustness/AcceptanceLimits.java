package com.loopwright.solver.robustness;

/**
 * The limits a simulated step is judged against (upper limits; null when not judged).
 *
 * @param settlingTimeSeconds settling time limit to the band
 * @param riseTimeSeconds     10-90% rise time limit
 * @param overshootPercent    overshoot limit
 * @param bandFraction        settling band as a fraction of the final value
 */
public record AcceptanceLimits(
        Double settlingTimeSeconds, Double riseTimeSeconds, Double overshootPercent, double bandFraction) {

    public AcceptanceLimits {
        if (!(bandFraction > 0 && bandFraction < 1)) {
            throw new IllegalArgumentException("bandFraction must be in (0, 1)");
        }
    }

    /** True when every given limit holds; a metric that is not reached (null) fails its limit. */
    public boolean met(Double settlingTime, Double riseTime, double overshoot) {
        if (settlingTimeSeconds != null && (settlingTime == null || settlingTime > settlingTimeSeconds)) {
            return false;
        }
        if (riseTimeSeconds != null && (riseTime == null || riseTime > riseTimeSeconds)) {
            return false;
        }
        return overshootPercent == null || overshoot <= overshootPercent;
    }

    /** Whether any limit is given at all. */
    public boolean judges() {
        return settlingTimeSeconds != null || riseTimeSeconds != null || overshootPercent != null;
    }
}
