package com.loopwright.api.robustness;

/** Either plusMinusPercent of the nominal value, or an absolute [min, max]. */
public record ParameterRangeInput(Double plusMinusPercent, Double min, Double max) {}
