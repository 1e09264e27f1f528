package com.loopwright.solver.discrete;

/**
 * The commissioning settings around the law: asymmetric command limits, the operating point and the tolerance of
 * the measured-period check.
 *
 * <p>Operating point: the law works on deviations rd = r - y0[0], yd[j] = y[j] - y0[j] (the setpoint is in the units
 * of the first measured channel, the position), and the command is u = clamp(u0 + g v, uMin, uMax) with the gain
 * scale g in [0, 1].
 *
 * @param commandMin              uMin, the lower command limit [u units]
 * @param commandMax              uMax &gt; uMin, the upper command limit [u units]
 * @param commandBias             u0, added after the law [u units]
 * @param measurementBias         y0, one per measured channel, subtracted before the law
 * @param periodToleranceFraction the measured period is flagged when |Tm - T| &gt; tolerance T (0 &lt; tol &lt; 1)
 */
public record ControllerSettings(
        double commandMin,
        double commandMax,
        double commandBias,
        double[] measurementBias,
        double periodToleranceFraction) {

    /** Default tolerance of the period check: 10 % (common practice for task-jitter alarms). */
    public static final double DEFAULT_PERIOD_TOLERANCE = 0.1;

    public ControllerSettings {
        if (!Double.isFinite(commandMin) || !Double.isFinite(commandMax) || !(commandMin < commandMax)) {
            throw new IllegalArgumentException("the command limits must be finite with min < max");
        }
        if (!Double.isFinite(commandBias)) {
            throw new IllegalArgumentException("the command bias must be finite");
        }
        if (measurementBias.length < 1 || measurementBias.length > DiscreteController.MAX_MEASURED) {
            throw new IllegalArgumentException("one measurement bias per measured channel");
        }
        for (double y0 : measurementBias) {
            if (!Double.isFinite(y0)) {
                throw new IllegalArgumentException("the measurement bias must be finite");
            }
        }
        measurementBias = measurementBias.clone();
        if (!(periodToleranceFraction > 0 && periodToleranceFraction < 1)) {
            throw new IllegalArgumentException("the period tolerance must lie in (0, 1)");
        }
    }

    /** Symmetric limits +-limit, no bias, the default tolerance: today's law. */
    public static ControllerSettings symmetric(double commandLimit, int measuredCount) {
        return new ControllerSettings(
                -commandLimit, commandLimit, 0, new double[measuredCount], DEFAULT_PERIOD_TOLERANCE);
    }

    @Override
    public double[] measurementBias() {
        return measurementBias.clone();
    }
}
