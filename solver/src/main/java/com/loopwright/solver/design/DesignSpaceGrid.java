package com.loopwright.solver.design;

/**
 * The grid of a design-space map: a time spec (settling time to a band, or 10-90% rise time) against the
 * overshoot, each axis evenly spaced from its lowest to its highest value.
 *
 * @param settlingAxis             true: the time axis is the settling time; false: the rise time
 * @param timeLowestSeconds        first time column [s]
 * @param timeHighestSeconds       last time column [s]
 * @param timeCount                number of time columns, at least 2
 * @param overshootLowestPercent   first overshoot row [%]
 * @param overshootHighestPercent  last overshoot row [%]
 * @param overshootCount           number of overshoot rows, at least 2
 * @param bandFraction             settling band as a fraction of the final value
 */
public record DesignSpaceGrid(
        boolean settlingAxis,
        double timeLowestSeconds,
        double timeHighestSeconds,
        int timeCount,
        double overshootLowestPercent,
        double overshootHighestPercent,
        int overshootCount,
        double bandFraction) {

    public DesignSpaceGrid {
        if (!(timeLowestSeconds > 0 && timeLowestSeconds < timeHighestSeconds && Double.isFinite(timeHighestSeconds))) {
            throw new IllegalArgumentException("time axis needs 0 < lowest < highest");
        }
        if (!(overshootLowestPercent > 0
                && overshootLowestPercent < overshootHighestPercent
                && overshootHighestPercent < 100)) {
            throw new IllegalArgumentException("overshoot axis needs 0 < lowest < highest < 100");
        }
        if (timeCount < 2 || overshootCount < 2) {
            throw new IllegalArgumentException("each axis needs at least two points");
        }
        if (!(bandFraction > 0 && bandFraction < 1)) {
            throw new IllegalArgumentException("bandFraction must be in (0, 1)");
        }
    }

    /** The time of column i: lowest + i (highest - lowest)/(count - 1) [s]. */
    public double timeAt(int column) {
        return column == timeCount - 1
                ? timeHighestSeconds
                : timeLowestSeconds + column * (timeHighestSeconds - timeLowestSeconds) / (timeCount - 1);
    }

    /** The overshoot of row j [%]. */
    public double overshootAt(int row) {
        return row == overshootCount - 1
                ? overshootHighestPercent
                : overshootLowestPercent
                        + row * (overshootHighestPercent - overshootLowestPercent) / (overshootCount - 1);
    }

    /** Number of cells. */
    public int cellCount() {
        return timeCount * overshootCount;
    }
}
