package com.loopwright.api.verification;

import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.validation.SpecInput;

/**
 * Body of POST /v1/verifications: a plant (the canonical form, named), gains the caller already has, optional specs to judge pass/fail
 * (overshootPercent, settlingTime or riseTime, settlingBandPercent, stepSize), optional performance weights, and the
 * checks to run.
 */
public record VerificationRequest(
        VerificationPlantInput plant,
        GainInput gain,
        SpecInput spec,
        PerformanceInput performance,
        VerifyInput verify) {}
