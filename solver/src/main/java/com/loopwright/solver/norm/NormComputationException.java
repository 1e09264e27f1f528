package com.loopwright.solver.norm;

/**
 * Thrown when the H-infinity norm iteration cannot produce a trustworthy value: no convergence
 * within the iteration cap, or a failed eigenvalue computation.
 */
public final class NormComputationException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    public NormComputationException(String message) {
        super(message);
    }
}
