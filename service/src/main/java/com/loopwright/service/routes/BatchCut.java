package com.loopwright.service.routes;

import com.loopwright.api.problem.Problem;

/**
 * The last NDJSON line of a batch stream that the service ended early (schema BatchCut in openapi.yaml): a shutdown
 * reached its grace period while items were still being computed. Items from {@code resumeFromIndex} on have no
 * line; send them again (to another instance).
 *
 * @param resumeFromIndex position of the first item of the request that has no line
 * @param status          503: the service is not ready for these items
 * @param problem         why the stream was cut (type not-ready)
 */
public record BatchCut(int resumeFromIndex, int status, Problem problem) {}
