package com.loopwright.api.validation;

/**
 * Time-domain specs and design options as sent by the caller (nullable until validated). Times in seconds,
 * overshoot and band in percent.
 */
public record SpecInput(
        Double settlingTime,
        Double overshootPercent,
        Double settlingBandPercent,
        Double riseTime,
        Double gamma,
        Double gammaMargin,
        Double stepSize) {}
