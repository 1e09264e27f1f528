package com.loopwright.api.designspace;

/**
 * One axis of a design-space map: {@code count} evenly spaced values from {@code lowest} to {@code highest}.
 *
 * @param lowest  first value, in the axis quantity's unit (s or %)
 * @param highest last value
 * @param count   number of values, 2 to 64 (the cap)
 */
public record AxisInput(Double lowest, Double highest, Integer count) {}
