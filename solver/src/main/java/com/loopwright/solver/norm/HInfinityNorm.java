package com.loopwright.solver.norm;

/**
 * H-infinity norm of a stable, strictly proper transfer matrix G(s) = C (sI - A)^-1 B.
 *
 * @param value sup over w >= 0 of sigma_max(G(jw)); equals sigma_max(G(j peakFrequencyRadPerSec))
 *     and is within relative {@code 2 * HInfinityNormCalculator.RELATIVE_TOLERANCE} below the true norm
 * @param peakFrequencyRadPerSec frequency (rad/s, >= 0) at which {@code value} is attained
 * @param iterations number of Hamiltonian eigenvalue tests performed
 */
public record HInfinityNorm(double value, double peakFrequencyRadPerSec, int iterations) {

    public HInfinityNorm {
        if (!Double.isFinite(value) || value < 0) {
            throw new IllegalArgumentException("norm value must be finite and >= 0, got " + value);
        }
        if (!Double.isFinite(peakFrequencyRadPerSec) || peakFrequencyRadPerSec < 0) {
            throw new IllegalArgumentException("peak frequency must be finite and >= 0, got " + peakFrequencyRadPerSec);
        }
        if (iterations < 0) {
            throw new IllegalArgumentException("iterations must be >= 0, got " + iterations);
        }
    }
}
