package com.loopwright.api.problem;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * RFC 9457 problem details, with two extension members: the offending fields and, for infeasible specs,
 * computed proposals.
 */
@JsonInclude(JsonInclude.Include.NON_EMPTY)
public record Problem(
        String type,
        String title,
        int status,
        String detail,
        String instance,
        List<FieldError> errors,
        List<Proposal> proposals) {

    public static final String MEDIA_TYPE = "application/problem+json";

    public Problem {
        errors = errors == null ? List.of() : List.copyOf(errors);
        proposals = proposals == null ? List.of() : List.copyOf(proposals);
    }

    public Problem withInstance(String path) {
        return new Problem(type, title, status, detail, path, errors, proposals);
    }
}
