package com.loopwright.solver.plant;

import java.util.List;

/**
 * A fitted model y(t) = y0 + K A S(wn (t - t_step - theta); zeta), where S is the unit step response of
 * wn^2/(s^2 + 2 zeta wn s + wn^2) and A the input step.
 *
 * @param gain              K [output units per input unit]
 * @param naturalFrequency  wn [rad/s]
 * @param dampingRatio      zeta
 * @param deadTimeSeconds   theta (0 when not estimated)
 * @param initialOffset     y0 (0 when not estimated)
 * @param parameters        every estimated parameter with standard error and interval
 * @param rmsError          sqrt(mean squared residual)
 * @param rSquared          1 - SSR/SST
 * @param degreesOfFreedom  n - p
 * @param iterations        LM iterations of the run that gave the result
 * @param evaluations       model evaluations of that run
 * @param warnings          findings about the data
 */
public record StepFit(
        double gain,
        double naturalFrequency,
        double dampingRatio,
        double deadTimeSeconds,
        double initialOffset,
        List<FittedParameter> parameters,
        double rmsError,
        double rSquared,
        int degreesOfFreedom,
        int iterations,
        int evaluations,
        List<FitWarning> warnings) {

    public StepFit {
        parameters = List.copyOf(parameters);
        warnings = List.copyOf(warnings);
    }

    public FittedParameter parameter(String name) {
        return parameters.stream()
                .filter(p -> p.name().equals(name))
                .findFirst()
                .orElseThrow();
    }
}
