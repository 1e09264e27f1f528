package com.loopwright.api.robustness;

/** Documented ranges and caps of the robustness checks (openapi.yaml states the same numbers; a test holds them). */
public final class VerifyLimits {

    public static final int MAX_MONTE_CARLO_SAMPLES = 2000;
    public static final int MAX_DISTURBANCES = 8;
    public static final int MAX_FREQUENCY_POINTS = 500;
    public static final int MIN_TIME_SERIES_POINTS = 2;
    public static final int MAX_TIME_SERIES_POINTS = 1000;
    public static final double MAX_SPREAD_PERCENT = 90;
    public static final double MAX_ABS_AMPLITUDE = 1e9;
    public static final double MAX_TIME_SECONDS = 1e4;
    public static final double MIN_SAMPLE_PERIOD = 1e-7;
    public static final double MAX_FREQUENCY = 1e7;
    public static final double MAX_ACTUATOR_LIMIT = 1e12;
    public static final double MAX_TOLERANCE_PERCENT = 100;
    public static final double DEFAULT_TOLERANCE_PERCENT = 10;
    public static final double MAX_ABS_GAIN = 1e12;
    public static final double MAX_WEIGHT = 1e12;
    public static final long DEFAULT_SEED = 1;
    /** Problem.errors holds at most this many entries (openapi.yaml maxItems); the rest are dropped. */
    public static final int MAX_FIELD_ERRORS = 32;

    /** The first {@value #MAX_FIELD_ERRORS} errors. */
    public static java.util.List<com.loopwright.api.problem.FieldError> capped(
            java.util.List<com.loopwright.api.problem.FieldError> errors) {
        return errors.size() <= MAX_FIELD_ERRORS ? errors : errors.subList(0, MAX_FIELD_ERRORS);
    }

    private VerifyLimits() {}
}
