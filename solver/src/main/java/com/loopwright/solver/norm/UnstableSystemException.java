package com.loopwright.solver.norm;

/**
 * Thrown when the state matrix A is not Hurwitz (some eigenvalue has real part at or, within
 * rounding, near zero or above): the H-infinity norm of C (sI - A)^-1 B is then infinite or
 * undefined as a stable-system gain.
 */
public final class UnstableSystemException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    public UnstableSystemException(String message) {
        super(message);
    }
}
