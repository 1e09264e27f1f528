package com.loopwright.api.loop;

import com.loopwright.solver.pipeline.LoopStructure;

/**
 * The loop-structure fields after validation.
 *
 * @param structure    integral action, measurement and observer in solver terms
 * @param loadStepSize the load step w0 of the recovery figures
 * @param samplePeriod the sensor's sample period when the caller gave it (observer.samplePeriod), else null
 */
public record ValidatedLoop(LoopStructure structure, double loadStepSize, Double samplePeriod) {}
