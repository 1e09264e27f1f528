package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.SaturatedStepSimulator;

/** The reference step with an actuator limit |u| &lt;= limit, against the acceptance limits. */
final class SaturationCheck {

    private final SaturatedStepSimulator saturated;

    SaturationCheck(SaturatedStepSimulator saturated) {
        this.saturated = saturated;
    }

    /**
     * @param unsaturatedPeakControl exact max |u| of the linear loop for the step
     * @param horizonSeconds         the slow horizon
     */
    SaturationReport run(
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            double limit,
            AcceptanceLimits limits,
            double unsaturatedPeakControl,
            double horizonSeconds) {
        DenseTrajectory trajectory = null;
        GridMetrics metrics = null;
        try {
            trajectory = saturated.simulate(plant, gains, stepSize, limit, horizonSeconds);
            metrics = GridMetrics.of(
                    trajectory, LoopMatrices.unitStepFinalValue(plant, gains) * stepSize, limits.bandFraction());
        } catch (IllegalArgumentException e) {
            trajectory = null; // the state overflowed: the limited actuator cannot hold this loop
        }
        double peak = unsaturatedPeakControl;
        // peak |u| is linear in the step size: limit |step| / peak is the largest step within the limit
        return new SaturationReport(
                limit,
                peak,
                peak > limit,
                peak == 0 ? null : limit * Math.abs(stepSize) / peak,
                metrics == null,
                metrics,
                Verdict.ofStep(limits, metrics),
                trajectory);
    }
}
