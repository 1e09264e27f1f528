package com.loopwright.solver.pipeline;

/** How the observer gain is chosen. */
public sealed interface ObserverChoice permits ObserverChoice.Kalman, ObserverChoice.PoleMultiple {

    /**
     * Steady-state Kalman filter by a Riccati equation.
     *
     * @param processIntensity     q &gt; 0, white-noise intensity at the disturbance input
     * @param measurementIntensity v &gt; 0, white-noise intensity of the measurement
     */
    record Kalman(double processIntensity, double measurementIntensity) implements ObserverChoice {
        public Kalman {
            if (!(processIntensity > 0) || !Double.isFinite(processIntensity)) {
                throw new IllegalArgumentException("the process intensity must be positive and finite");
            }
            if (!(measurementIntensity > 0) || !Double.isFinite(measurementIntensity)) {
                throw new IllegalArgumentException("the measurement intensity must be positive and finite");
            }
        }

        /**
         * From a sensor of resolution Delta read every T seconds: the rounding error is uniform with variance
         * Delta^2 / 12, and a white sequence of variance sigma^2 held for T has the intensity sigma^2 T (common
         * practice for quantization noise).
         */
        public static Kalman fromResolution(double processIntensity, double resolution, double samplePeriodSeconds) {
            if (!(resolution > 0) || !(samplePeriodSeconds > 0)) {
                throw new IllegalArgumentException("resolution and sample period must be positive");
            }
            return new Kalman(processIntensity, resolution * resolution / 12 * samplePeriodSeconds);
        }
    }

    /**
     * Observer poles at a multiple of the controller poles (the dominant pair and the plant's auxiliary poles).
     *
     * @param multiple &gt; 0, typically 2 to 10 (common practice)
     */
    record PoleMultiple(double multiple) implements ObserverChoice {
        /** Observer poles five times faster than the controller's unless the caller says otherwise. */
        public static final double DEFAULT_MULTIPLE = 5;

        public PoleMultiple {
            if (!(multiple > 0) || !Double.isFinite(multiple)) {
                throw new IllegalArgumentException("the observer pole multiple must be positive and finite");
            }
        }
    }
}
