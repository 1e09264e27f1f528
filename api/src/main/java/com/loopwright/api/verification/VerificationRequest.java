package com.loopwright.api.verification;

import com.loopwright.api.loop.ObserverInput;
import com.loopwright.api.robustness.VerifyInput;
import com.loopwright.api.validation.SpecInput;
import java.util.List;

/**
 * Body of POST /v1/verifications: a plant (the canonical form, named), gains the caller already has, optional specs to judge pass/fail
 * (overshootPercent, settlingTime or riseTime, settlingBandPercent, stepSize), optional performance weights, and the
 * checks to run. gain.integralGain, measurement, observerGain, observer or loadStepSize ask for the loop section.
 *
 * @param measurement  "fullState" (default) or "position"
 * @param observerGain the caller's observer gain [l1, l2] (position)
 * @param observer     instead of observerGain: a kalman observer designed for the caller (position)
 * @param loadStepSize the load step of the loop section
 */
public record VerificationRequest(
        VerificationPlantInput plant,
        GainInput gain,
        SpecInput spec,
        PerformanceInput performance,
        VerifyInput verify,
        String measurement,
        List<Double> observerGain,
        ObserverInput observer,
        Double loadStepSize) {

    /** A request without the loop section. */
    public VerificationRequest(
            VerificationPlantInput plant,
            GainInput gain,
            SpecInput spec,
            PerformanceInput performance,
            VerifyInput verify) {
        this(plant, gain, spec, performance, verify, null, null, null, null);
    }

    /** True when the request asks for the loop section. */
    public boolean asksForLoop() {
        return (gain != null && gain.integralGain() != null)
                || measurement != null
                || observerGain != null
                || observer != null
                || loadStepSize != null;
    }
}
