package com.loopwright.api.result;

/**
 * One requested spec against its simulated value.
 *
 * @param spec      the request field name
 * @param requested the requested value (an upper limit)
 * @param simulated the simulated value
 * @param met       true when the simulated value meets the request (within the documented tolerance)
 */
public record SpecCheck(String spec, double requested, double simulated, boolean met) {}
