package com.loopwright.solver.design;

/**
 * The output after a constant load step w0 applied at t = 0 with r = 0 (the loop at rest before), simulated by the
 * exact zero-order hold at uniform samples.
 *
 * @param loadStepSize            w0, in disturbance units
 * @param steadyOffset            y(inf) from the final-value theorem, -C A^-1 B1 w0 (0 with integral action)
 * @param simulatedFinalOutput    y at the end of the window
 * @param peakDeviation           max |y(t)| over the window (at the samples)
 * @param peakTimeSeconds         where it is reached
 * @param recoveryTimeSeconds     last sample time where |y - y(inf)| exceeds RECOVERY_BAND_FRACTION x peak |y - y(inf)|
 * @param peakCommand             max |u(t)| over the window (at the samples)
 * @param horizonSeconds          simulated window
 * @param samples                 samples on it
 */
public record LoadStepResponse(
        double loadStepSize,
        double steadyOffset,
        double simulatedFinalOutput,
        double peakDeviation,
        double peakTimeSeconds,
        double recoveryTimeSeconds,
        double peakCommand,
        double horizonSeconds,
        int samples) {

    /** The recovery band as a fraction of the peak deviation from the final value (common practice: 2%). */
    public static final double RECOVERY_BAND_FRACTION = 0.02;
}
