package com.loopwright.api.verification;

import com.loopwright.api.robustness.RobustnessResponse;

/** Body of a successful POST /v1/verifications. */
public record VerificationResponse(
        RobustnessResponse.PlantView plant, RobustnessResponse.GainView gain, RobustnessResponse robustness) {}
