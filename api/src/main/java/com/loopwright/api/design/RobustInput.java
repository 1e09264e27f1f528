package com.loopwright.api.design;

import com.loopwright.api.robustness.UncertaintyInput;

/**
 * The robust-design member of a design request: gains that meet the spec on every corner and seeded Monte Carlo
 * sample of the box (nullable until validated).
 *
 * @param uncertainty   the parameter box, in the same shape as verify.uncertainty (required)
 * @param actuatorLimit every case's max |u| must stay at or below this, u units (optional)
 * @param samplePeriod  the controller's task period [s]: every case is judged by the sampled loop the exported
 *                      controller makes at it (optional; absent: judged in continuous time)
 */
public record RobustInput(UncertaintyInput uncertainty, Double actuatorLimit, Double samplePeriod) {}
