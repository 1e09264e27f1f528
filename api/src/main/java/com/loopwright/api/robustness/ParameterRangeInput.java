package com.loopwright.api.robustness;

/**
 * The range of one plant parameter: either a symmetric spread around the nominal value, or an explicit range.
 *
 * @param spreadPercent half-width of the range in percent of the nominal value: [p - |p| s/100, p + |p| s/100]
 * @param lowest        lowest value of an explicit range, in the parameter's own units
 * @param highest       highest value of an explicit range, in the parameter's own units
 */
public record ParameterRangeInput(Double spreadPercent, Double lowest, Double highest) {}
