package com.loopwright.solver.cancel;

/**
 * The checkpoint long solver loops call once per pass (a Monte Carlo sample, a fit evaluation, a spec-matching
 * iteration): it ends the computation when the thread running it has been interrupted, which is how a caller
 * cancels work it no longer waits for (a compute deadline that has passed). The interrupt flag is read, not cleared,
 * so the layers above still see it. No state of its own: the thread's interrupt flag is the token.
 */
public final class Cancellation {

    private Cancellation() {}

    /**
     * Returns at once when the current thread is not interrupted.
     *
     * @throws ComputationCancelledException when it is
     */
    public static void checkpoint() {
        if (Thread.currentThread().isInterrupted()) {
            throw new ComputationCancelledException();
        }
    }
}
