package com.loopwright.api.plant;

/**
 * Canonical plant coefficients of x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w, for endpoints that take gains
 * the caller already has (those gains act on exactly these states, so no other plant form is accepted).
 */
public record CanonicalPlantInput(Double a0, Double a1, Double b, Double d) {
}
