package com.loopwright.api.fit;

/**
 * Body of POST /v1/models/fit (nullable until validated).
 *
 * @param samples               the logged step test
 * @param stepTime              time of the input step [s]; default: read from samples.input, else 0
 * @param stepAmplitude         size of the input step [input units]; default: read from samples.input, else 1
 * @param estimateDeadTime      fit a dead time; default false
 * @param estimateInitialOffset fit the output's value before the step; default true
 */
public record FitRequest(
        SamplesInput samples,
        Double stepTime,
        Double stepAmplitude,
        Boolean estimateDeadTime,
        Boolean estimateInitialOffset) {}
