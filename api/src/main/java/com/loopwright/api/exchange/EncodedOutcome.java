package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.Problem;
import java.io.IOException;
import java.io.OutputStream;
import java.util.Arrays;

/**
 * The result of one exchange ready for the wire: either the 200 body as UTF-8 JSON bytes or a problem, never
 * both. The bytes were written by a finite-number-checking serializer (see FiniteNumbersModule), so they hold
 * no NaN or Infinity.
 *
 * @param status  HTTP status
 * @param json    the 200 body (copied in and out), or null when there is a problem
 * @param problem the problem when status is not 200, else null
 */
public record EncodedOutcome(int status, byte[] json, Problem problem) {

    public EncodedOutcome {
        if ((json == null) == (problem == null)) {
            throw new IllegalArgumentException("exactly one of a body and a problem");
        }
        json = json == null ? null : json.clone();
    }

    public static EncodedOutcome success(byte[] json) {
        return new EncodedOutcome(200, json, null);
    }

    public static EncodedOutcome failure(Problem problem) {
        return new EncodedOutcome(problem.status(), null, problem);
    }

    /** An outcome of a tree-building exchange, written with {@code mapper}. */
    public static EncodedOutcome of(Outcome outcome, ObjectMapper mapper) throws JsonProcessingException {
        return outcome.ok() ? success(mapper.writeValueAsBytes(outcome.body())) : failure(outcome.problem());
    }

    @Override
    public byte[] json() {
        return json == null ? null : json.clone();
    }

    public boolean ok() {
        return problem == null;
    }

    /** Writes the 200 body without copying it. */
    public void writeTo(OutputStream out) throws IOException {
        if (json == null) {
            throw new IllegalStateException("a problem has no 200 body");
        }
        out.write(json);
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof EncodedOutcome o && status == o.status && Arrays.equals(json, o.json)
                && java.util.Objects.equals(problem, o.problem);
    }

    @Override
    public int hashCode() {
        return 31 * (31 * status + Arrays.hashCode(json)) + java.util.Objects.hashCode(problem);
    }

    @Override
    public String toString() {
        return "EncodedOutcome[status=" + status + ", bytes=" + (json == null ? 0 : json.length) + ", problem="
                + problem + "]";
    }
}
