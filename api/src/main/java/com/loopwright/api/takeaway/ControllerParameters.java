package com.loopwright.api.takeaway;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.loopwright.api.robustness.RobustnessResponse;
import java.util.List;

/**
 * The sampled controller as a parameter set (POST /v1/designs/controllers/parameters).
 *
 * @param law                    the law in words
 * @param discretization         how the continuous design was carried to the sampled controller: "emulation" (the
 *                               plain law, gains unchanged) or "zeroOrderHold" (the loop's controller states)
 * @param samplePeriod           task period [s]
 * @param positionGain           k1
 * @param velocityGain           k2
 * @param referenceGain          kr (setpoint feedforward)
 * @param integralGain           ki on the integral of r - x1, with integral action; else null
 * @param observerGain           L of the observer, with position-only sensing; else null
 * @param actuatorRange          the command range the law clamps to (from actuatorLimit: -limit..limit)
 * @param operatingPoint         the operating point (output y0, command u0)
 * @param periodTolerancePercent the measured-period check's tolerance [% of samplePeriod]
 * @param sampledSpectralRadius  largest |eigenvalue| of the unclamped sampled loop (stable below 1)
 * @param periodPerTimeConstant  wn T
 * @param gamma                  H-infinity level of the continuous design
 * @param continuousStep         step metrics of the continuous loop (the design's verification, unclamped)
 * @param sampledStep            step metrics of this sampled loop (zero-order hold at samplePeriod,
 *                               unclamped, observed at and between the samples); null when not simulated
 * @param cautions               safety cautions
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record ControllerParameters(
        String law,
        String discretization,
        double samplePeriod,
        double positionGain,
        double velocityGain,
        double referenceGain,
        Double integralGain,
        List<Double> observerGain,
        ActuatorRange actuatorRange,
        OperatingPoint operatingPoint,
        double periodTolerancePercent,
        double sampledSpectralRadius,
        double periodPerTimeConstant,
        double gamma,
        RobustnessResponse.Metrics continuousStep,
        RobustnessResponse.Metrics sampledStep,
        List<String> cautions) {

    public ControllerParameters {
        cautions = List.copyOf(cautions);
        observerGain = observerGain == null ? null : List.copyOf(observerGain);
    }
}
