package com.loopwright.solver.design;

/**
 * The loop's response (r = 0) to one disturbance profile.
 *
 * @param peakDeviation          max |x1| on the grid, x1 units
 * @param integralAbsoluteError  integral of |x1| dt (trapezoid on the grid), x1 units * s
 * @param integralSquaredError   integral of x1^2 dt, exact for the held w (Van Loan), x1 units^2 * s
 * @param recoverySeconds        time from the last change of w until |x1 - x1_final| stays within
 *                               simulation.DisturbanceSimulator.RECOVERY_BAND_FRACTION of the peak deviation (grid
 *                               resolution); null for persistent profiles or if not recovered in the horizon
 * @param peakControl            max |u| on the grid
 * @param disturbanceEnergy      ||w||_2, exact for the held signal
 * @param outputEnergy           ||z||_2 over the horizon, exact for the held signal (Van Loan)
 * @param observedGain           ||z||_2 / ||w||_2 (0 when w = 0)
 * @param trajectory             the dense trajectory
 */
public record DisturbanceResponse(
        double peakDeviation,
        double integralAbsoluteError,
        double integralSquaredError,
        Double recoverySeconds,
        double peakControl,
        double disturbanceEnergy,
        double outputEnergy,
        double observedGain,
        DenseTrajectory trajectory) {}
