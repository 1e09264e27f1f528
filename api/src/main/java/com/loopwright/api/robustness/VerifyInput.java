package com.loopwright.api.robustness;

import java.util.List;

/**
 * Robustness checks to run on a loop (every member optional; nullable until validated).
 *
 * @param uncertainty       parameter ranges, corners and Monte Carlo
 * @param disturbances      disturbance profiles
 * @param actuatorLimit     |u| limit, u units
 * @param sampling          sampled implementation
 * @param inputDelay        input delay [s]
 * @param frequencyPoints   log-spaced frequency response points
 * @param timeSeriesPoints  points per returned time series
 * @param tolerancePercent  the limits judged are the spec widened by this percentage of each limit
 */
public record VerifyInput(
        UncertaintyInput uncertainty,
        List<DisturbanceInput> disturbances,
        Double actuatorLimit,
        SamplingInput sampling,
        Double inputDelay,
        Integer frequencyPoints,
        Integer timeSeriesPoints,
        Double tolerancePercent) {}
