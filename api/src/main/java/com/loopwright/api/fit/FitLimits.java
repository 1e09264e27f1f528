package com.loopwright.api.fit;

import com.loopwright.solver.pipeline.FitPipeline;

/** Documented caps and ranges of POST /v1/models/fit (openapi.yaml states the same numbers). */
public final class FitLimits {

    /** Samples per array; 20 000 samples of time, output and input fit the 1 MiB body cap. */
    public static final int MAX_SAMPLES = 20_000;

    public static final int MIN_SAMPLES = FitPipeline.MIN_SAMPLES;
    public static final double MAX_ABS_TIME_SECONDS = 1e9;
    public static final double MAX_ABS_SIGNAL = 1e12;

    private FitLimits() {}
}
