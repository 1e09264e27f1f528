package com.loopwright.api.request;

/**
 * Plant coefficients of x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w, as sent by the caller (nullable until
 * validated).
 */
public record PlantInput(Double a0, Double a1, Double b, Double d) {
}
