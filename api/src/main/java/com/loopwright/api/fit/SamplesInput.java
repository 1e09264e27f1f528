package com.loopwright.api.fit;

import java.util.List;

/**
 * Samples of a step test: time [s], strictly increasing, not necessarily uniform; the measured output; and,
 * optionally, the logged input (from which the step time and size are read).
 */
public record SamplesInput(List<Double> time, List<Double> output, List<Double> input) {}
