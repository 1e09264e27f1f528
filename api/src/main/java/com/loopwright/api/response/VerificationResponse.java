package com.loopwright.api.response;

/** Body of a successful POST /v1/verifications. */
public record VerificationResponse(RobustnessResponse.PlantView plant, RobustnessResponse.GainView gain,
                                   RobustnessResponse robustness) {
}
