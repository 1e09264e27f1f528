package com.loopwright.api.plot;

/**
 * Axis ticks at "nice" numbers 1, 2, 5 x 10^k covering [low, high] (common practice for chart axes): the
 * tick step is the nice number nearest range / (target - 1), and the axis is widened to whole steps.
 *
 * @param start first tick (at or below the data)
 * @param step  spacing between ticks, a nice number
 * @param count number of ticks, at most {@value #MAX_TICKS}
 */
public record NiceTicks(double start, double step, int count) {

    /** Largest number of ticks on one axis. */
    public static final int MAX_TICKS = 24;

    public static NiceTicks covering(double low, double high, int target) {
        if (!Double.isFinite(low) || !Double.isFinite(high)) {
            throw new IllegalArgumentException("axis limits must be finite");
        }
        if (high < low) {
            double t = low;
            low = high;
            high = t;
        }
        if (high - low < 1e-12 * Math.max(1, Math.abs(high))) {
            double pad = Math.abs(high) > 0 ? Math.abs(high) * 0.1 : 1;
            low -= pad;
            high += pad;
        }
        int wanted = Math.max(2, Math.min(target, MAX_TICKS / 2));
        double step = nice((high - low) / (wanted - 1));
        double start = Math.floor(low / step) * step;
        double end = Math.ceil(high / step) * step;
        int count = (int) Math.round((end - start) / step) + 1;
        return new NiceTicks(start, step, Math.min(count, MAX_TICKS));
    }

    /** Nearest of 1, 2, 5, 10 times a power of ten. */
    static double nice(double raw) {
        double exponent = Math.floor(Math.log10(raw));
        double fraction = raw / Math.pow(10, exponent);
        double niceFraction = fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10;
        return niceFraction * Math.pow(10, exponent);
    }

    public double end() {
        return start + step * (count - 1);
    }

    public double tick(int index) {
        return start + step * index;
    }

    /** The tick's label with as many decimals as the step needs (no "0.30000000000000004"). */
    public String label(int index) {
        int decimals = Math.max(0, (int) -Math.floor(Math.log10(step) + 1e-9));
        double value = tick(index);
        if (Math.abs(value) < step * 1e-6) {
            value = 0;
        }
        return String.format(java.util.Locale.ROOT, "%." + decimals + "f", value);
    }
}
