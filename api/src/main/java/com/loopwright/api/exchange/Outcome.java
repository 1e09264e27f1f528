package com.loopwright.api.exchange;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.problem.Problem;

/**
 * The result of one exchange: either a 200 body or a problem, never both.
 *
 * @param status  HTTP status
 * @param body    the JSON body (a response tree, or the problem as a tree)
 * @param problem the problem when status is not 200, else null
 */
public record Outcome(int status, JsonNode body, Problem problem) {

    public boolean ok() {
        return problem == null;
    }

    /** application/json for a result, application/problem+json for a problem. */
    public String mediaType() {
        return problem == null ? "application/json" : Problem.MEDIA_TYPE;
    }
}
