package com.loopwright.solver.robustness;

/** The nominal loop with the given gains is not stable, so there is no step response to verify. */
public final class UnstableLoopException extends RuntimeException {

    public UnstableLoopException(String message) {
        super(message);
    }
}
