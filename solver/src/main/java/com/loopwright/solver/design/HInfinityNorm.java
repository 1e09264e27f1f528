package com.loopwright.solver.design;

/**
 * H-infinity norm of a stable, strictly proper transfer matrix G(s) = C (sI - A)^-1 B.
 *
 * @param value                  a certified upper bound of sup over w >= 0 of sigma_max(G(jw)): never below the
 *                               norm and at most a factor {@code 1 + norm.HInfinityNormCalculator.RELATIVE_TOLERANCE}
 *                               above it (exact up to rounding for the closed-form two-state peak)
 * @param peakFrequencyRadPerSec frequency (rad/s, >= 0) of the largest evaluated gain, refined to a local maximum
 * @param attainedGain           sigma_max(G(j peakFrequencyRadPerSec)), a lower bound of the norm, <= value
 * @param iterations             number of Hamiltonian eigenvalue tests performed
 */
public record HInfinityNorm(double value, double peakFrequencyRadPerSec, double attainedGain, int iterations) {

    public HInfinityNorm {
        if (!Double.isFinite(value) || value < 0) {
            throw new IllegalArgumentException("norm value must be finite and >= 0, got " + value);
        }
        if (!Double.isFinite(peakFrequencyRadPerSec) || peakFrequencyRadPerSec < 0) {
            throw new IllegalArgumentException("peak frequency must be finite and >= 0, got " + peakFrequencyRadPerSec);
        }
        if (!Double.isFinite(attainedGain) || attainedGain < 0 || attainedGain > value) {
            throw new IllegalArgumentException(
                    "attained gain must be finite, >= 0 and <= the norm " + value + ", got " + attainedGain);
        }
        if (iterations < 0) {
            throw new IllegalArgumentException("iterations must be >= 0, got " + iterations);
        }
    }

    /** A norm attained exactly at its peak frequency (closed form, or zero). */
    public HInfinityNorm(double value, double peakFrequencyRadPerSec, int iterations) {
        this(value, peakFrequencyRadPerSec, value, iterations);
    }
}
