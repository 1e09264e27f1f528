package com.loopwright.solver.fit;

/** The samples do not determine a second-order model, or the least-squares fit did not converge. */
public final class FitFailedException extends RuntimeException {

    public FitFailedException(String reason) {
        super(reason);
    }
}
