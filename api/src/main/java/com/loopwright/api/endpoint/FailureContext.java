package com.loopwright.api.endpoint;

import com.loopwright.api.validation.SpecInput;

/**
 * The request pointers a failure is reported at, per endpoint.
 *
 * @param prefix              prefix of plant and spec pointers ("" or "/design" when the design request is nested)
 * @param timeSpecPointer     pointer of the time spec the caller gave
 * @param verifyPointer       pointer of the verify object (cap-exceeded checks point inside it)
 * @param unstableLoopPointer pointer blamed for an unstable loop
 * @param sentSpec            the spec object as the caller sent it, or null: when present, each proposal of an
 *                            infeasible spec carries the whole spec with its value in place, ready to send back
 */
public record FailureContext(
        String prefix, String timeSpecPointer, String verifyPointer, String unstableLoopPointer, SpecInput sentSpec) {

    /** A request at the root with a settling-time spec. */
    public static final FailureContext ROOT = new FailureContext("", "/spec/settlingTime", "/verify", "/gain");

    /** A context without the sent spec (proposals carry only their value). */
    public FailureContext(String prefix, String timeSpecPointer, String verifyPointer, String unstableLoopPointer) {
        this(prefix, timeSpecPointer, verifyPointer, unstableLoopPointer, null);
    }

    /** The same, with the time spec the caller gave. */
    public FailureContext withTimeSpec(String pointer) {
        return new FailureContext(prefix, pointer, verifyPointer, unstableLoopPointer, sentSpec);
    }

    /** The same, with the spec object the caller sent. */
    public FailureContext withSentSpec(SpecInput spec) {
        return new FailureContext(prefix, timeSpecPointer, verifyPointer, unstableLoopPointer, spec);
    }
}
