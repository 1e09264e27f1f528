package com.loopwright.solver.robustness;

import com.loopwright.solver.plant.DisturbanceProfile;
import java.util.List;

/**
 * Which checks to run (null or empty means not run).
 *
 * @param parameterBox            parameter ranges for the uncertainty check
 * @param monteCarloSamples       Monte Carlo samples inside the box (0 to {@value UncertaintyAnalyzer#MAX_SAMPLES})
 * @param seed                    generator seed
 * @param disturbances            disturbance profiles
 * @param actuatorLimit           |u| limit
 * @param samplePeriod     Ts of a sampled implementation
 * @param searchLongestPeriod     search the longest Ts that meets the limits
 * @param inputDelaySeconds       input delay to simulate
 * @param frequencyPoints         log-spaced frequency response points (0 for margins only)
 * @param seriesPoints            points per returned time series (0 for none)
 */
public record RobustnessOptions(
        ParameterBox parameterBox,
        int monteCarloSamples,
        long seed,
        List<DisturbanceProfile> disturbances,
        Double actuatorLimit,
        Double samplePeriod,
        boolean searchLongestPeriod,
        Double inputDelaySeconds,
        int frequencyPoints,
        int seriesPoints) {

    public RobustnessOptions {
        disturbances = disturbances == null ? List.of() : List.copyOf(disturbances);
    }
}
