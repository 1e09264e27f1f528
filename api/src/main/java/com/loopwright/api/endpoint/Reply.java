package com.loopwright.api.endpoint;

import com.loopwright.api.problem.Problem;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.Objects;

/**
 * The answer of one endpoint, ready for the wire: a 200 body (bytes and media type) or a problem, never both.
 * JSON bodies were written through the finite-number guard, so they hold no NaN or Infinity. Immutable: a final
 * class rather than a record so that the body bytes, which the runner writes and hands over, are neither copied
 * in nor copied out on the way to the socket ({@link #bodyStream}, {@link #writeTo}); {@link #body()} returns a
 * copy.
 */
public final class Reply {

    /** The media type of JSON bodies. */
    public static final String JSON = "application/json";

    private final int status;
    private final String mediaType;
    private final byte[] body;
    private final Problem problem;
    private final String requestDigest;
    private final String fileName;

    private Reply(int status, String mediaType, byte[] body, Problem problem, String requestDigest, String fileName) {
        this.status = status;
        this.mediaType = mediaType;
        this.body = body;
        this.problem = problem;
        this.requestDigest = requestDigest;
        this.fileName = fileName;
    }

    /** A 200 body (copied). */
    public static Reply ok(String mediaType, byte[] body) {
        return owning(mediaType, body.clone());
    }

    /** A 200 body the runner has just written and nobody else holds. */
    static Reply owning(String mediaType, byte[] body) {
        return new Reply(
                200,
                Objects.requireNonNull(mediaType, "mediaType"),
                Objects.requireNonNull(body, "body"),
                null,
                null,
                null);
    }

    public static Reply failure(Problem problem) {
        return new Reply(
                problem.status(), Problem.MEDIA_TYPE, null, Objects.requireNonNull(problem, "problem"), null, null);
    }

    /** The same reply, stating the digest of the request it answers ({@link RequestDigest}). */
    public Reply traced(String digest) {
        return new Reply(status, mediaType, body, problem, Objects.requireNonNull(digest, "digest"), fileName);
    }

    /** The same 200 reply, to be saved under {@code name} ({@link Attachment}). */
    Reply attached(String name) {
        if (problem != null) {
            throw new IllegalStateException("a problem is not an attachment");
        }
        return new Reply(status, mediaType, body, problem, requestDigest, Objects.requireNonNull(name, "name"));
    }

    /**
     * The file name a 200 body is saved under ({@code Content-Disposition: attachment; filename="..."}), or null
     * when the body is shown rather than saved.
     */
    public String fileName() {
        return fileName;
    }

    /** {@link RequestDigest} of the decoded request, or null when the request did not decode. */
    public String requestDigest() {
        return requestDigest;
    }

    /** HTTP status. */
    public int status() {
        return status;
    }

    /** The body's media type; application/problem+json for a problem. */
    public String mediaType() {
        return mediaType;
    }

    /** The problem when status is not 200, else null. */
    public Problem problem() {
        return problem;
    }

    public boolean ok() {
        return problem == null;
    }

    /** A copy of the 200 body, or null when there is a problem. */
    public byte[] body() {
        return body == null ? null : body.clone();
    }

    /** The 200 body as UTF-8 text, or null when there is a problem. */
    public String text() {
        return body == null ? null : new String(body, StandardCharsets.UTF_8);
    }

    /** The 200 body as a stream over the bytes themselves (no copy). */
    public InputStream bodyStream() {
        return new ByteArrayInputStream(owned());
    }

    /** Writes the 200 body without copying it. */
    public void writeTo(OutputStream out) throws IOException {
        out.write(owned());
    }

    private byte[] owned() {
        if (body == null) {
            throw new IllegalStateException("a problem has no 200 body");
        }
        return body;
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof Reply o
                && status == o.status
                && Objects.equals(mediaType, o.mediaType)
                && Arrays.equals(body, o.body)
                && Objects.equals(problem, o.problem)
                && Objects.equals(requestDigest, o.requestDigest)
                && Objects.equals(fileName, o.fileName);
    }

    @Override
    public int hashCode() {
        return Objects.hash(status, mediaType, Arrays.hashCode(body), problem, requestDigest, fileName);
    }

    @Override
    public String toString() {
        return "Reply[status=" + status + ", mediaType=" + mediaType + ", bytes=" + (body == null ? 0 : body.length)
                + ", problem=" + problem + ", requestDigest=" + requestDigest + ", fileName=" + fileName + "]";
    }
}
