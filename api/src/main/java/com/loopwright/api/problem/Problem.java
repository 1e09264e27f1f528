package com.loopwright.api.problem;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * RFC 9457 problem details, with three extension members: the offending fields, for infeasible specs computed
 * proposals, and for an unknown name in a path (a figure, a controller format) the names that path takes.
 *
 * <p>{@code instance} identifies the occurrence (RFC 9457 section 3.1.5: a URI reference identifying the specific
 * occurrence of the problem), not the resource: the service sets it to {@code /requests/<request-id>}, the id also
 * answered in {@code X-Request-Id} and written on every log line of that request, so a client quoting the problem
 * quotes what an operator searches for. A batch item's problem adds its JSON pointer as fragment
 * ({@code /requests/<request-id>#/items/3}). The form is a relative reference in our own path space: no URN
 * namespace to register, it resolves against the service's own origin, and accepted request ids hold only URI path
 * characters, so it needs no escaping. It is an identifier, not a link: nothing is served at that path. The request
 * path is not used, because it names the resource (the same for every failing call), not the occurrence. The api
 * leaves it empty; only the HTTP layer knows the request id.
 */
@JsonInclude(JsonInclude.Include.NON_EMPTY)
public record Problem(
        String type,
        String title,
        int status,
        String detail,
        String instance,
        List<FieldError> errors,
        List<Proposal> proposals,
        List<String> validNames) {

    public static final String MEDIA_TYPE = "application/problem+json";

    /** A problem names at most this many field errors (openapi.yaml: Problem.errors maxItems). */
    public static final int MAX_ERRORS = 32;

    public Problem {
        errors = errors == null ? List.of() : List.copyOf(errors);
        proposals = proposals == null ? List.of() : List.copyOf(proposals);
        validNames = validNames == null ? List.of() : List.copyOf(validNames);
    }

    /** A problem without valid names (every problem but an unknown name in a path). */
    public Problem(
            String type,
            String title,
            int status,
            String detail,
            String instance,
            List<FieldError> errors,
            List<Proposal> proposals) {
        this(type, title, status, detail, instance, errors, proposals, List.of());
    }

    /** The same problem, naming the occurrence {@code instance} (a URI reference, see the class comment). */
    public Problem withInstance(String instance) {
        return new Problem(type, title, status, detail, instance, errors, proposals, validNames);
    }

    /** The same problem, listing the names a path segment takes (a 404 for an unknown figure or format). */
    public Problem withValidNames(List<String> names) {
        return new Problem(type, title, status, detail, instance, errors, proposals, names);
    }
}
