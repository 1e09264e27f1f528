package com.loopwright.api.robustness;

/** Ranges of the plant parameters (absent: fixed at nominal), Monte Carlo count and seed. */
public record UncertaintyInput(
        ParameterRangeInput a0,
        ParameterRangeInput a1,
        ParameterRangeInput b,
        ParameterRangeInput d,
        Integer monteCarloSamples,
        Long seed) {}
