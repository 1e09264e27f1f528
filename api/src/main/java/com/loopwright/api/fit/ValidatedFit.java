package com.loopwright.api.fit;

import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.StepTestData;
import java.util.List;

/**
 * A fit request after validation.
 *
 * @param data       samples and the step
 * @param options    which optional parameters to estimate
 * @param stepSource where the step time and amplitude came from: "input", "request" or "default"
 * @param notes      findings about the logged input
 */
public record ValidatedFit(StepTestData data, FitOptions options, String stepSource, List<String> notes) {

    public ValidatedFit {
        notes = List.copyOf(notes);
    }
}
