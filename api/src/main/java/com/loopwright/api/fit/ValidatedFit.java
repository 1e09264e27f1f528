package com.loopwright.api.fit;

import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.StepTestData;

/**
 * A fit request after validation.
 *
 * @param data       samples and the step
 * @param options    which optional parameters to estimate
 * @param stepSource where the step time and amplitude came from: "input", "request" or "default"
 * @param notes      findings about the logged input, each with its code
 */
public record ValidatedFit(StepTestData data, FitOptions options, String stepSource, FitNotes notes) {}
