package com.loopwright.api.exchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.Problem;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.util.Arrays;
import java.util.Objects;

/**
 * The result of one exchange ready for the wire: either the 200 body as UTF-8 JSON bytes or a problem, never
 * both. The bytes were written by a finite-number-checking serializer (see FiniteNumbersModule), so they hold no
 * NaN or Infinity. Immutable: a final class rather than a record so that the body bytes, which the exchange
 * writes and hands over, are neither copied in nor copied out on the way to the socket ({@link #jsonStream},
 * {@link #writeTo}); {@link #json()} returns a copy.
 */
public final class EncodedOutcome {

    private final int status;
    private final byte[] json;
    private final Problem problem;

    private EncodedOutcome(int status, byte[] json, Problem problem) {
        this.status = status;
        this.json = json;
        this.problem = problem;
    }

    /** A 200 body (copied). */
    public static EncodedOutcome success(byte[] json) {
        return owning(json.clone());
    }

    /** A 200 body this package has just written and nobody else holds. */
    static EncodedOutcome owning(byte[] json) {
        return new EncodedOutcome(200, Objects.requireNonNull(json, "json"), null);
    }

    public static EncodedOutcome failure(Problem problem) {
        return new EncodedOutcome(problem.status(), null, Objects.requireNonNull(problem, "problem"));
    }

    /** An outcome of a tree-building exchange, written with {@code mapper}. */
    public static EncodedOutcome of(Outcome outcome, ObjectMapper mapper) throws JsonProcessingException {
        return outcome.ok() ? owning(mapper.writeValueAsBytes(outcome.body())) : failure(outcome.problem());
    }

    /** HTTP status. */
    public int status() {
        return status;
    }

    /** The problem when status is not 200, else null. */
    public Problem problem() {
        return problem;
    }

    public boolean ok() {
        return problem == null;
    }

    /** A copy of the 200 body, or null when there is a problem. */
    public byte[] json() {
        return json == null ? null : json.clone();
    }

    /** The 200 body as a stream over the bytes themselves (no copy). */
    public InputStream jsonStream() {
        return new ByteArrayInputStream(body());
    }

    /** Writes the 200 body without copying it. */
    public void writeTo(OutputStream out) throws IOException {
        out.write(body());
    }

    private byte[] body() {
        if (json == null) {
            throw new IllegalStateException("a problem has no 200 body");
        }
        return json;
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof EncodedOutcome o && status == o.status && Arrays.equals(json, o.json)
                && Objects.equals(problem, o.problem);
    }

    @Override
    public int hashCode() {
        return 31 * (31 * status + Arrays.hashCode(json)) + Objects.hashCode(problem);
    }

    @Override
    public String toString() {
        return "EncodedOutcome[status=" + status + ", bytes=" + (json == null ? 0 : json.length) + ", problem="
                + problem + "]";
    }
}
