package com.loopwright.api.problem;

import java.util.List;

/**
 * The problem types this service emits; {@code type} URIs are stable identifiers documented in openapi.yaml.
 *
 * <p>Each type is a tag URI (RFC 4151), {@code tag:loopwright.dev,2026:problem/<name>}: a globally unique
 * identifier minted under a domain name and a date, needing no registration (unlike a URN namespace) and never
 * dereferenced (RFC 9457 section 3.1.1 allows a non-resolvable URI; nothing is served at it).
 */
public enum ProblemType {
    MALFORMED_REQUEST(400, "Malformed request", "The body is not the JSON this endpoint takes."),
    INVALID_FIELD(400, "Invalid field", "A field is missing, of the wrong type or out of its documented range."),
    NOT_FOUND(404, "Not found", "No such resource."),
    METHOD_NOT_ALLOWED(405, "Method not allowed", "This resource does not take that method."),
    PAYLOAD_TOO_LARGE(413, "Payload too large", "The body exceeds the documented size cap."),
    UNSUPPORTED_MEDIA_TYPE(415, "Unsupported media type", "Send the body as application/json."),
    INFEASIBLE_SPEC(422, "Infeasible spec", "The plant cannot meet the spec with this method."),
    UNVERIFIABLE_DESIGN(
            422,
            "Design could not be verified",
            "The design is outside the range where it can be computed and verified in double precision."),
    CAP_EXCEEDED(422, "Computation cap exceeded", "A requested check would exceed a documented computation cap."),
    UNSTABLE_LOOP(422, "Unstable loop", "The loop with these gains is not stable, so it cannot be verified."),
    INTERNAL_ERROR(500, "Internal error", "The service failed; the request id identifies it in the logs."),
    PLANT_MODEL_UNUSABLE(
            422,
            "Plant model not usable",
            "The plant description is not physical, not controllable, or outside the canonical form."),
    FIT_FAILED(422, "Model fit failed", "The samples do not determine a second-order model."),
    UNAUTHORIZED(401, "Unauthorized", "Send an API key as Authorization: Bearer <key> or X-Api-Key."),
    FORBIDDEN(403, "Forbidden", "The credentials do not grant this request."),
    SERVICE_OVERLOADED(503, "Service overloaded", "Every design worker is busy; retry after the Retry-After delay."),
    DEADLINE_EXCEEDED(504, "Compute deadline exceeded", "The design did not finish within the compute deadline."),
    NOT_READY(503, "Not ready", "The service is shutting down or not yet able to take designs."),
    MALFORMED_HTTP(
            400, "Malformed HTTP request", "The request line, a header or the body framing is not valid HTTP/1.1."),
    REQUEST_TIMEOUT(
            408,
            "Request timeout",
            "The request did not arrive in time; send the body at least at the documented minimum rate."),
    UNSUPPORTED_PROTOCOL(505, "Unsupported protocol", "This service speaks HTTP/1.1 (and HTTP/1.0) only.");

    private final int status;
    private final String title;
    private final String defaultDetail;

    ProblemType(int status, String title, String defaultDetail) {
        this.status = status;
        this.title = title;
        this.defaultDetail = defaultDetail;
    }

    public int status() {
        return status;
    }

    /** The tagging entity and date of every type URI (RFC 4151 section 2.1: authorityName "," date). */
    public static final String URI_PREFIX = "tag:loopwright.dev,2026:problem/";

    /** Stable identifier, e.g. "tag:loopwright.dev,2026:problem/infeasible-spec". */
    public String uri() {
        return URI_PREFIX + name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
    }

    public Problem problem(String detail) {
        return new Problem(uri(), title, status, detail == null ? defaultDetail : detail, null, List.of(), List.of());
    }

    public Problem problem(String detail, List<FieldError> errors, List<Proposal> proposals) {
        return new Problem(uri(), title, status, detail, null, errors, proposals);
    }
}
