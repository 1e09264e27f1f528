package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.SampledLaw;
import java.util.Optional;

/**
 * A design turned into a sampled controller, with the caller's export options.
 *
 * @param design      the continuous design (the plain full-state law)
 * @param law         the plain law emulated at the period, checked; the law exported when {@code loop} is empty
 * @param sampledStep the step of the plain sampled loop (zero-order hold, unclamped), or empty when it diverges or
 *                    the period is too short to simulate over the horizon
 * @param options     the period, command range, operating point, period tolerance, prefix and arithmetic
 * @param loop        the loop with integral action and/or an observer that is exported instead, when asked for
 */
public record ControllerExport(
        DesignReport design,
        SampledLaw law,
        Optional<GridMetrics> sampledStep,
        ControllerOptions options,
        Optional<LoopExport> loop) {}
