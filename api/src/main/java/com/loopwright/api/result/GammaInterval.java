package com.loopwright.api.result;

import com.fasterxml.jackson.annotation.JsonInclude;

/**
 * One interval of the feasible gamma set: every gamma strictly between lower and upper completes the design.
 * upper and upperBinding are absent when the interval is unbounded (JSON has no infinity); lowerBinding is absent
 * only when no requirement bounds gamma (an order-2 plant without disturbance input).
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record GammaInterval(
        double lower, Double upper, boolean unbounded, IntervalEnd lowerBinding, IntervalEnd upperBinding) {}
