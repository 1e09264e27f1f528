package com.loopwright.solver.verify;

/** An independent check could not be computed (ill-conditioned numbers); the design is not certified. */
public final class VerificationFailedException extends RuntimeException {

    public VerificationFailedException(String message, Throwable cause) {
        super(message, cause);
    }
}
