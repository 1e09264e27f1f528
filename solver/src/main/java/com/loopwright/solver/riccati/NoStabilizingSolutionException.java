package com.loopwright.solver.riccati;

/**
 * Thrown when the Riccati equation {@code A'P + PA + PRP + Q = 0} has no stabilizing solution
 * (no symmetric P with {@code A + RP} Hurwitz), or when such a solution could not be computed to a
 * trustworthy accuracy.
 *
 * <p>Typical engineering causes: the Hamiltonian has eigenvalues on (or numerically on) the
 * imaginary axis, e.g. an H-infinity level gamma at or below the achievable optimum; or an unstable
 * mode that R cannot act on (unstabilizable pair).
 */
public final class NoStabilizingSolutionException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    public NoStabilizingSolutionException(String message) {
        super(message);
    }
}
