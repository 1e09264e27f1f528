package com.loopwright.service.routes;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.problem.Problem;

/**
 * One NDJSON line of a batch response (schema BatchLine in openapi.yaml): exactly one of design and problem.
 *
 * @param index   position of the item in the request's items array
 * @param status  the HTTP status this item would have had as a single POST /v1/designs
 * @param design  the DesignResponse when status is 200, else null
 * @param problem the problem otherwise, else null
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record BatchLine(int index, int status, JsonNode design, Problem problem) {}
