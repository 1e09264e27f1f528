package com.loopwright.api.fit;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.List;

/**
 * Body of a successful POST /v1/models/fit: y(t) = initialOffset + gain A S(wn (t - stepTime - deadTime)),
 * S the unit step response of wn^2/(s^2 + 2 zeta wn s + wn^2) and A the input step.
 *
 * @param plant      the fitted model as a plant object that POST /v1/designs accepts as is
 * @param parameters every estimated parameter with standard error and 95% interval
 * @param deadTime   fitted dead time [s] (0 when not estimated); not part of {@code plant}
 * @param initialOffset fitted output before the step (0 when not estimated)
 * @param step       the step the fit assumed
 * @param quality    fit quality
 * @param warnings   findings that limit what the model can be trusted for
 * @param notes      remarks on the data and on using the model, in engineering words
 * @param noteCodes  the stable code of each note, index for index with notes
 */
public record FitResponse(
        FittedPlant plant,
        List<ParameterView> parameters,
        double deadTime,
        double initialOffset,
        StepView step,
        Quality quality,
        List<WarningView> warnings,
        List<String> notes,
        List<String> noteCodes,
        List<String> cautions) {

    public FitResponse {
        parameters = List.copyOf(parameters);
        warnings = List.copyOf(warnings);
        notes = List.copyOf(notes);
        noteCodes = List.copyOf(noteCodes);
        cautions = List.copyOf(cautions);
    }

    /** A secondOrderTransferFunction plant: gain wn^2/(s^2 + 2 zeta wn s + wn^2). */
    public record FittedPlant(String form, double gain, double naturalFrequency, double dampingRatio) {}

    /**
     * standardError, lower95 and upper95 are absent when the data do not determine the parameter (J'J singular
     * in its direction; a poorlyDetermined warning names it).
     *
     * @param lower95 estimate - t_{0.975, n-p} standardError, at least the lowest value the parameter can take
     * @param upper95 estimate + t_{0.975, n-p} standardError, at most the highest value the fit may give it
     */
    @JsonInclude(JsonInclude.Include.NON_NULL)
    public record ParameterView(
            String name, double estimate, Double standardError, Double lower95, Double upper95, String unit) {}

    /**
     * @param source "input" (read from samples.input), "request" (stepTime/stepAmplitude) or "default" (0 and 1)
     */
    public record StepView(double time, double amplitude, String source) {}

    /**
     * @param rmsError         root-mean-square residual [output units]
     * @param rSquared         1 - SSR/SST
     * @param samples          n
     * @param degreesOfFreedom n - p
     */
    public record Quality(
            double rmsError, double rSquared, int samples, int degreesOfFreedom, int iterations, int evaluations) {}

    public record WarningView(String code, String message) {}
}
