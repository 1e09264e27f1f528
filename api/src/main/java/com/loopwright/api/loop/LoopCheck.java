package com.loopwright.api.loop;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * The caller's law checked as it runs (POST /v1/verifications): u = kr r + ki xi - (k1 x1_hat + k2 x2_hat), xi' = r -
 * x1, with x_hat the measured state or the estimate of the observer.
 *
 * @param scope                        what this section covers, against the robustness section
 * @param law                          the law as a formula
 * @param integralGain                 ki (0: no integrator)
 * @param referenceGain                kr
 * @param observerGain                 L used (position sensing only): the caller's, or the one designed
 * @param observer                     the observer designed for the caller (observer asked for), absent otherwise
 * @param performanceOutput            z of peakDisturbanceGain
 * @param peakDisturbanceGain          the loop's peak gain from w to z (its H-infinity norm)
 * @param peakDisturbanceGainFrequency where it peaks [rad/s]
 * @param gamma                        performance.gamma when given
 * @param exceedsGamma                 peakDisturbanceGain &gt; gamma, when gamma is given
 * @param noiseToCommandGain           peak gain from measurement noise to u (position sensing only)
 * @param noiseToCommandGainFrequency  where it peaks [rad/s]
 * @param margins                      at the plant input
 * @param step                         the unit reference step
 * @param loadStep                     the load step
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record LoopCheck(
        String scope,
        String law,
        double integralGain,
        double referenceGain,
        List<Double> observerGain,
        Observer observer,
        String performanceOutput,
        double peakDisturbanceGain,
        double peakDisturbanceGainFrequency,
        Double gamma,
        Boolean exceedsGamma,
        Double noiseToCommandGain,
        Double noiseToCommandGainFrequency,
        InputMargins margins,
        LoopStep step,
        LoadStep loadStep) {

    public LoopCheck {
        observerGain = observerGain == null ? null : List.copyOf(observerGain);
    }
}
