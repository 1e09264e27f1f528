package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.SampledLaw;
import java.util.Optional;

/**
 * A design turned into a sampled control law, with the sampled loop's own step and the caller's export options.
 *
 * @param design      the continuous design it emulates
 * @param law         the law evaluated once per sample period
 * @param sampledStep the step of the sampled loop (zero-order hold, unclamped), or empty when it diverges or the
 *                    period is too short to simulate over the horizon
 * @param options     the period, command range, operating point, period tolerance, prefix and arithmetic
 */
public record ControllerExport(
        DesignReport design, SampledLaw law, Optional<GridMetrics> sampledStep, ControllerOptions options) {}
