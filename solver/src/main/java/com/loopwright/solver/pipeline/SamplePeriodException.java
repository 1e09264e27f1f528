package com.loopwright.solver.pipeline;

/** A robust design's sample period cannot be judged or cannot work for the spec; the message says why. */
final class SamplePeriodException extends RuntimeException {

    SamplePeriodException(String message) {
        super(message);
    }
}
