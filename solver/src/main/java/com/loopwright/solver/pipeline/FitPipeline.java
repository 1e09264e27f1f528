package com.loopwright.solver.pipeline;

import com.loopwright.solver.fit.FitFailedException;
import com.loopwright.solver.fit.StepResponseFitter;
import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.StepFit;
import com.loopwright.solver.plant.StepTestData;

/** The front door of the step-response fit; a failed fit is a {@link SolverFailure}. Stateless and thread-safe. */
public final class FitPipeline {

    /** Fewest samples a step test may have (the fitter's own floor). */
    public static final int MIN_SAMPLES = StepResponseFitter.MIN_SAMPLES;

    private final StepResponseFitter fitter = new StepResponseFitter();

    /** @throws SolverFailure FIT_FAILED when no usable model is found */
    public StepFit fit(StepTestData data, FitOptions options) {
        try {
            return fitter.fit(data, options);
        } catch (FitFailedException e) {
            throw SolverFailure.of(SolverFailure.Kind.FIT_FAILED, e.getMessage(), e);
        }
    }
}
