package com.loopwright.solver.spec;

/** The time-domain spec that, with the overshoot, fixes the natural frequency. */
public sealed interface TimeSpec permits TimeSpec.SettlingTime, TimeSpec.RiseTime {

    /** The spec value [s]. */
    double seconds();

    /** Normalized time wn t of this spec at damping ratio zeta; wn = normalizedTime / seconds. */
    double normalizedTime(double dampingRatio);

    /**
     * Settling time to a band: last exit of |y - y_final| &lt;= band |y_final|.
     *
     * @param seconds      settling time [s]
     * @param bandFraction band as a fraction of the final value (0.02 for the 2% band)
     */
    record SettlingTime(double seconds, double bandFraction) implements TimeSpec {
        public SettlingTime {
            requirePositiveSeconds(seconds);
            if (!(bandFraction > 0 && bandFraction < 1)) {
                throw new IllegalArgumentException("settling band must lie in (0, 1)");
            }
        }

        @Override
        public double normalizedTime(double dampingRatio) {
            return NormalizedSettlingTime.of(dampingRatio, bandFraction);
        }
    }

    /** 10-90% rise time [s]. */
    record RiseTime(double seconds) implements TimeSpec {
        public RiseTime {
            requirePositiveSeconds(seconds);
        }

        @Override
        public double normalizedTime(double dampingRatio) {
            return NormalizedRiseTime.of(dampingRatio);
        }
    }

    private static void requirePositiveSeconds(double seconds) {
        if (!(seconds > 0) || !Double.isFinite(seconds)) {
            throw new IllegalArgumentException("time spec must be positive and finite");
        }
    }
}
