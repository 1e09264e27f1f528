package com.loopwright.solver.robustness;

import com.loopwright.solver.plant.CanonicalPlant;

/**
 * Distribution of one metric over the stable, measured cases (corners and samples).
 *
 * @param min      smallest value
 * @param median   median (mean of the two middle values for an even count)
 * @param max      largest value, the worst case
 * @param worstAt  parameters of the worst case
 * @param count    number of cases measured
 */
public record MetricSummary(double min, double median, double max, CanonicalPlant worstAt, int count) {}
