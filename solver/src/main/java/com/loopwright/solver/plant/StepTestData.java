package com.loopwright.solver.plant;

/**
 * A logged step test: samples of the output at strictly increasing times, after a step of the input of size
 * stepAmplitude at stepTimeSeconds.
 */
public record StepTestData(double[] timeSeconds, double[] output, double stepTimeSeconds, double stepAmplitude) {

    public StepTestData {
        if (timeSeconds.length != output.length || timeSeconds.length == 0) {
            throw new IllegalArgumentException("time and output must have the same non-zero length");
        }
        for (int i = 0; i < timeSeconds.length; i++) {
            if (!Double.isFinite(timeSeconds[i])
                    || !Double.isFinite(output[i])
                    || i > 0 && !(timeSeconds[i] > timeSeconds[i - 1])) {
                throw new IllegalArgumentException("samples must be finite at strictly increasing times");
            }
        }
        if (!Double.isFinite(stepTimeSeconds) || !Double.isFinite(stepAmplitude) || stepAmplitude == 0) {
            throw new IllegalArgumentException("step time must be finite and the amplitude non-zero");
        }
        timeSeconds = timeSeconds.clone();
        output = output.clone();
    }

    @Override
    public double[] timeSeconds() {
        return timeSeconds.clone();
    }

    @Override
    public double[] output() {
        return output.clone();
    }

    /** Number of samples. */
    public int size() {
        return timeSeconds.length;
    }
}
