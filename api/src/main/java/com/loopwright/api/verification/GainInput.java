package com.loopwright.api.verification;

/** Gains of u = kr r - (k1 x1 + k2 x2) the caller already has. */
public record GainInput(Double k1, Double k2, Double referenceGain) {}
