package com.loopwright.api.robustness;

/**
 * One disturbance profile: shape step, pulse, sinusoid or randomBounded, with its amplitude in w units and the
 * members its shape uses (start and duration [s], frequency [rad/s], holdTime [s], seed).
 */
public record DisturbanceInput(
        String shape, Double amplitude, Double start, Double duration, Double frequency, Double holdTime, Long seed) {}
