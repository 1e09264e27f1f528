package com.loopwright.api.result;

/**
 * One requirement's lower bound on gamma.
 *
 * @param condition       wire name of the requirement ({@link GammaConditions#wireName})
 * @param state           the 1-based state index for a per-state requirement (weightReal), else 0
 * @param meaning         what holds above the bound, in words
 * @param gammaLowerBound the smallest gamma at which the requirement holds
 * @param binding         true for the requirement that sets gammaMin
 */
public record GammaBound(String condition, int state, String meaning, double gammaLowerBound, boolean binding) {}
