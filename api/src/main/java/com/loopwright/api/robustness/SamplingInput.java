package com.loopwright.api.robustness;

/** A sampled implementation: period Ts [s], and whether to search the longest Ts that still meets the spec. */
public record SamplingInput(Double samplePeriod, Boolean findLongest) {}
