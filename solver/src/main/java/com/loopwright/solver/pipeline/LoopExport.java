package com.loopwright.solver.pipeline;

import com.loopwright.solver.discrete.DiscreteController;

/**
 * A loop with integral action and/or an observer, discretized exactly for the task period (zero-order hold).
 *
 * @param report                the continuous loop design it comes from
 * @param controller            the discrete controller every text writes
 * @param sampledSpectralRadius largest |eigenvalue| of the sampled loop (plant under zero-order hold and this
 *                              controller, unclamped), below {@link ExportPipeline#MAX_LOOP_SPECTRAL_RADIUS}
 */
public record LoopExport(RealLoopReport report, DiscreteController controller, double sampledSpectralRadius) {}
