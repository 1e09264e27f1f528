package com.loopwright.api.request;

/** A sampled implementation: period Ts [s], and whether to search the longest Ts that still meets the spec. */
public record SamplingInput(Double samplePeriod, Boolean findLongest) {
}
