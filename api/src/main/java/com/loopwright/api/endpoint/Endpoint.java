package com.loopwright.api.endpoint;

import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import java.util.List;

/**
 * One endpoint's steps between the decoded request and the response body; {@link EndpointRunner} runs them.
 * Each step may fail with an {@link com.loopwright.api.validation.InvalidRequestException} (every field error at
 * once), a {@link com.loopwright.solver.plant.PlantParameterException} or a
 * {@link com.loopwright.solver.pipeline.SolverFailure}; the runner maps them in {@link FailureTable}, in the
 * pointer context the endpoint gives ({@link #failureContext}).
 *
 * @param <Q> the wire request record, decoded strictly
 * @param <V> the request after validation, in solver terms
 * @param <R> what the solver computed
 */
public interface Endpoint<Q, V, R> {

    /** The type the body is decoded into. */
    Class<Q> requestType();

    /** Checks the request: the validated form, or an InvalidRequestException with every field error. */
    V validate(Q request);

    /**
     * Field errors that validation found but the endpoint reports only after computing (the verify object's, once
     * the spec is known to be feasible); a request that did not decode is never computed, and its answer names
     * them at once with the decoding errors. None by default.
     */
    default List<FieldError> deferredErrors(V validated) {
        return List.of();
    }

    /** Runs the solver through its front door (solver.pipeline). */
    R compute(V validated);

    /**
     * The response: a record written as JSON through the finite-number guard, or a {@link Text} body, either of
     * them possibly an {@link Attachment} (saved under a file name).
     */
    Object respond(V validated, R result);

    /**
     * The response, knowing which build answers which request; by default {@link #respond(Object, Object)} (the
     * runner adds the trace to a JSON body itself; a {@link Text} body states it in its own way). The trace is null
     * only for a request without a canonical form, which validation refuses.
     */
    default Object respond(V validated, R result, Trace trace) {
        return respond(validated, result);
    }

    /** The problem for a NaN or an infinity met while writing the JSON response, at {@code pointer}. */
    Problem nonFinite(String pointer);

    /**
     * The problem for a response that {@link #respond} could not write (an argument outside what a writer can
     * draw or print); by default the failure is not the caller's and passes on.
     */
    default Problem unwritable(IllegalArgumentException failure) {
        throw failure;
    }

    /** Where this endpoint's failures point; {@code validated} is null when validation itself failed. */
    default FailureContext failureContext(V validated) {
        return FailureContext.ROOT;
    }
}
