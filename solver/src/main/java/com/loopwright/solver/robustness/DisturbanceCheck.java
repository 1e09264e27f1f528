package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DisturbanceResponse;
import com.loopwright.solver.plant.DisturbanceProfile;

/**
 * One disturbance profile and its response.
 *
 * @param profile        the profile
 * @param response       the response
 * @param withinNorm     observedGain &lt;= hinfNorm (1 + 1e-8)
 * @param withinGamma    observedGain &lt;= gamma (NOT_JUDGED when no gamma is known)
 */
public record DisturbanceCheck(
        DisturbanceProfile profile, DisturbanceResponse response, boolean withinNorm, Verdict withinGamma) {}
