package com.loopwright.api.designspace;

import com.loopwright.api.plant.PlantInput;
import com.loopwright.api.robustness.UncertaintyInput;
import com.loopwright.api.validation.SpecInput;

/**
 * Body of POST /v1/design-spaces and /v1/design-spaces/figure.
 *
 * @param plant               the plant, any form
 * @param settlingTime        the time axis as settling times [s] (or give riseTime)
 * @param riseTime            the time axis as 10-90% rise times [s]
 * @param overshootPercent    the overshoot axis [%]
 * @param settlingBandPercent settling band of every cell [%], default 2
 * @param spec                optional: the spec to mark (settlingTime or riseTime, as the axis, and
 *                            overshootPercent)
 * @param uncertainty         optional parameter box, as verify.uncertainty (monteCarloSamples at most 64 here)
 * @param actuatorLimit       optional |u| limit, u units
 * @param samplePeriod        optional period of the sampled law [s]
 * @param stepSize            the reference step the peak command is computed for, default 1
 * @param tolerancePercent    a box case meets a cell widened by this percentage of each limit, default 10
 */
public record DesignSpaceRequest(
        PlantInput plant,
        AxisInput settlingTime,
        AxisInput riseTime,
        AxisInput overshootPercent,
        Double settlingBandPercent,
        SpecInput spec,
        UncertaintyInput uncertainty,
        Double actuatorLimit,
        Double samplePeriod,
        Double stepSize,
        Double tolerancePercent) {}
