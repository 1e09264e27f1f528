package com.loopwright.api.loop;

/**
 * The output after a constant load step w0 at t = 0 with r = 0, on the loop that runs (with the observer when the
 * position alone is measured).
 *
 * @param loadStepSize         w0 [w units]
 * @param steadyOffset         y(inf) by the final-value theorem, -C A^-1 B1 w0 of the closed loop (0 with integral
 *                             action)
 * @param zeroSteadyOffset     true with integral action: the integrator removes the offset of a constant load
 * @param simulatedFinalOutput y at the end of the simulated window
 * @param peakDeviation        max |y| over the window
 * @param peakTime             where [s]
 * @param recoveryTime         last time |y - y(inf)| exceeds 2 % of its peak [s]
 * @param peakControl          max |u| over the window (the name of simulated.peakControl)
 * @param horizon              simulated window [s]
 * @param samples              samples on it
 */
public record LoadStep(
        double loadStepSize,
        double steadyOffset,
        boolean zeroSteadyOffset,
        double simulatedFinalOutput,
        double peakDeviation,
        double peakTime,
        double recoveryTime,
        double peakControl,
        double horizon,
        int samples) {}
