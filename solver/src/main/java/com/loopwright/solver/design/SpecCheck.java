package com.loopwright.solver.design;

/**
 * One requested spec against its simulated value. Specs are upper limits.
 *
 * @param spec      the spec's name on the wire (overshootPercent, settlingTime, riseTime)
 * @param requested requested limit, in the spec's units
 * @param simulated simulated value, same units
 * @param met       simulated &lt;= requested within the stated tolerance
 */
public record SpecCheck(String spec, double requested, double simulated, boolean met) {}
