package com.loopwright.solver.pipeline;

/**
 * A simulated step on a sample grid, for drawing.
 *
 * @param timeSeconds sample times t_k
 * @param output      the tracked output x1(t_k)
 * @param control     the command u(t_k)
 */
public record StepSeries(double[] timeSeconds, double[] output, double[] control) {

    public StepSeries {
        if (timeSeconds.length != output.length || timeSeconds.length != control.length) {
            throw new IllegalArgumentException("a step series needs as many outputs and commands as sample times");
        }
        timeSeconds = timeSeconds.clone();
        output = output.clone();
        control = control.clone();
    }

    @Override
    public double[] timeSeconds() {
        return timeSeconds.clone();
    }

    @Override
    public double[] output() {
        return output.clone();
    }

    @Override
    public double[] control() {
        return control.clone();
    }
}
