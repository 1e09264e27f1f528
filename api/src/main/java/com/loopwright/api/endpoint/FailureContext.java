package com.loopwright.api.endpoint;

/**
 * The request pointers a failure is reported at, per endpoint.
 *
 * @param prefix              prefix of plant and spec pointers ("" or "/design" when the design request is nested)
 * @param timeSpecPointer     pointer of the time spec the caller gave
 * @param verifyPointer       pointer of the verify object (cap-exceeded checks point inside it)
 * @param unstableLoopPointer pointer blamed for an unstable loop
 */
public record FailureContext(String prefix, String timeSpecPointer, String verifyPointer, String unstableLoopPointer) {

    /** A request at the root with a settling-time spec. */
    public static final FailureContext ROOT = new FailureContext("", "/spec/settlingTime", "/verify", "/gain");

    /** The same, with the time spec the caller gave. */
    public FailureContext withTimeSpec(String pointer) {
        return new FailureContext(prefix, pointer, verifyPointer, unstableLoopPointer);
    }
}
