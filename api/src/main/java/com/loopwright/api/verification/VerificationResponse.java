package com.loopwright.api.verification;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.loop.LoopCheck;
import com.loopwright.api.robustness.RobustnessResponse;
import java.util.List;

/**
 * Body of a successful POST /v1/verifications.
 *
 * @param plant      the plant checked
 * @param gain       the caller's gains
 * @param robustness the checks
 * @param cautions   the cautions every design carries (the same four as a design response)
 * @param loop       the caller's law as it runs (integral gain, observer), only when the request asked for it
 */
public record VerificationResponse(
        RobustnessResponse.PlantView plant,
        RobustnessResponse.GainView gain,
        RobustnessResponse robustness,
        List<String> cautions,
        @JsonInclude(JsonInclude.Include.NON_NULL) LoopCheck loop) {

    public VerificationResponse {
        cautions = List.copyOf(cautions);
    }
}
