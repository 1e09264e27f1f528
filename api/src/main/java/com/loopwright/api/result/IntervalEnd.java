package com.loopwright.api.result;

/** What ends a gamma interval: a requirement (state: 1-based index for weightReal, else 0) or a search limit. */
public record IntervalEnd(String condition, int state, String meaning) {}
