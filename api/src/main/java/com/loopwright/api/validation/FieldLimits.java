package com.loopwright.api.validation;

import com.loopwright.solver.design.SpecRanges;

/**
 * Documented ranges of every request field (openapi.yaml states the same numbers; a test holds them together).
 * The ranges keep every intermediate quantity of the design well inside double precision.
 */
public final class FieldLimits {

    public static final double MAX_ABS_A0 = 1e8;
    public static final double MAX_ABS_A1 = 1e4;
    public static final double MIN_ABS_B = 1e-6;
    public static final double MAX_ABS_B = 1e8;
    public static final double MAX_ABS_D = 1e8;
    public static final double MIN_TIME_SECONDS = 1e-4;
    public static final double MAX_TIME_SECONDS = 1e4;
    public static final double MIN_OVERSHOOT_PERCENT = 0.001;
    public static final double MAX_OVERSHOOT_PERCENT = 95;
    public static final double MIN_BAND_PERCENT = 0.1;
    public static final double MAX_BAND_PERCENT = 20;
    public static final double DEFAULT_BAND_PERCENT = 2;
    public static final double MAX_GAMMA = 1e12;
    public static final double MAX_GAMMA_MARGIN = 1000;
    public static final double DEFAULT_GAMMA_MARGIN = 1.2;
    public static final double MAX_ABS_STEP = 1e9;
    public static final double DEFAULT_STEP = 1;
    /** Magnitude cap of physical parameters and state-space entries (the derived coefficients are checked too). */
    public static final double MAX_ABS_PHYSICAL = 1e12;
    /** A transfer-function numerator is given highest power first, with at most this many coefficients. */
    public static final int MAX_NUMERATOR_COEFFICIENTS = 3;

    /** The spec ranges above, for the solver's proposals (a proposal is always a request these limits accept). */
    public static final SpecRanges SPEC_RANGES =
            new SpecRanges(MIN_OVERSHOOT_PERCENT, MAX_OVERSHOOT_PERCENT, MIN_TIME_SECONDS, MAX_TIME_SECONDS, MAX_GAMMA);

    private FieldLimits() {}
}
