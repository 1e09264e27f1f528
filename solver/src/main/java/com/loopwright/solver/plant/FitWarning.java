package com.loopwright.solver.plant;

/**
 * Something about the data that limits what the fitted model can be trusted for.
 *
 * @param code    stable identifier
 * @param message the finding, in engineering words
 */
public record FitWarning(Code code, String message) {

    public enum Code {
        RECORD_TOO_SHORT,
        FEW_SAMPLES_IN_TRANSIENT,
        SATURATION_PLATEAU,
        NOISE_DOMINATES,
        POORLY_DETERMINED,
        DEAD_TIME_NOT_IN_DESIGN,
        WEAK_EXCITATION,
        AT_BOUND
    }
}
