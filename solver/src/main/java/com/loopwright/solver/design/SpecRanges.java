package com.loopwright.solver.design;

/**
 * The ranges a request may state its specs in; a proposal always lies inside them, so that it can be posted back.
 *
 * @param minOvershootPercent smallest accepted overshoot [%]
 * @param maxOvershootPercent largest accepted overshoot [%]
 * @param minTimeSeconds      shortest accepted settling or rise time [s]
 * @param maxTimeSeconds      longest accepted settling or rise time [s]
 * @param maxGamma            largest accepted fixed gamma
 */
public record SpecRanges(
        double minOvershootPercent,
        double maxOvershootPercent,
        double minTimeSeconds,
        double maxTimeSeconds,
        double maxGamma) {

    /** No bounds beyond those of the quantities themselves (overshoot in (0, 100) percent, times and gamma positive). */
    public static final SpecRanges UNBOUNDED =
            new SpecRanges(1e-300, 100, Double.MIN_VALUE, Double.MAX_VALUE, Double.MAX_VALUE);

    public SpecRanges {
        if (!(minOvershootPercent > 0 && minOvershootPercent < maxOvershootPercent && maxOvershootPercent <= 100)
                || !(minTimeSeconds > 0 && minTimeSeconds < maxTimeSeconds)
                || !(maxGamma > 0)) {
            throw new IllegalArgumentException("spec ranges must be non-empty and positive");
        }
    }

    public boolean overshootInRange(double percent) {
        return percent >= minOvershootPercent && percent <= maxOvershootPercent && percent < 100;
    }

    public boolean timeInRange(double seconds) {
        return seconds >= minTimeSeconds && seconds <= maxTimeSeconds && Double.isFinite(seconds);
    }

    public boolean gammaInRange(double gamma) {
        return gamma > 0 && gamma <= maxGamma;
    }

    /** The value moved into [low, high]. */
    static double clamp(double value, double low, double high) {
        return Math.max(low, Math.min(high, value));
    }
}
