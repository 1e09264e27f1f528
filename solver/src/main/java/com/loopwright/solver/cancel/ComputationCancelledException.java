package com.loopwright.solver.cancel;

/**
 * The computation was cancelled at a {@link Cancellation#checkpoint()} (its thread was interrupted). Not an
 * {@link IllegalArgumentException}: the solver's overflow handlers must let it pass.
 */
public final class ComputationCancelledException extends RuntimeException {

    public ComputationCancelledException() {
        super("the computation was cancelled", null, false, false);
    }
}
