package com.loopwright.api.verification;

import com.loopwright.api.robustness.ValidatedVerify;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.pipeline.LoopCheckPipeline;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.robustness.AcceptanceLimits;

/**
 * A verification request after validation.
 *
 * @param plant       plant
 * @param gains       the caller's gains
 * @param stepSize    reference step
 * @param limits      the spec as given (before the tolerance widens it)
 * @param rho1        position weight of z, or null (then z = x1)
 * @param rho2        velocity weight of z, or null
 * @param gamma       bound to check the disturbance gain against, or null
 * @param verify      the checks
 * @param loop        the loop section's check of the caller's law as it runs, or null when not asked for
 */
public record ValidatedVerification(
        CanonicalPlant plant,
        FeedbackGains gains,
        double stepSize,
        AcceptanceLimits limits,
        Double rho1,
        Double rho2,
        Double gamma,
        ValidatedVerify verify,
        LoopCheckPipeline.Request loop) {}
