package com.loopwright.api.verification;

import com.loopwright.api.robustness.RobustnessResponse;
import java.util.List;

/**
 * Body of a successful POST /v1/verifications.
 *
 * @param plant      the plant checked
 * @param gain       the caller's gains
 * @param robustness the checks
 * @param cautions   the cautions every design carries (the same four as a design response)
 */
public record VerificationResponse(
        RobustnessResponse.PlantView plant,
        RobustnessResponse.GainView gain,
        RobustnessResponse robustness,
        List<String> cautions) {

    public VerificationResponse {
        cautions = List.copyOf(cautions);
    }
}
