package com.loopwright.api.takeaway;

/**
 * The operating point the designed model is linearised about: the law acts on deviations from it.
 *
 * @param output  y0, the measured position at the operating point, subtracted before the law [x1 units]; 0 if absent
 * @param command u0, the command that holds the operating point, added after the law [u units]; 0 if absent
 */
public record OperatingPoint(Double output, Double command) {}
