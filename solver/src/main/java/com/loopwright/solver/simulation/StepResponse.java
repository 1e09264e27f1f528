package com.loopwright.solver.simulation;

/**
 * Samples of a loop's response to a reference step, on a uniform time grid.
 *
 * @param timeSeconds sample times, from 0 to the horizon inclusive, strictly increasing
 * @param state state[k] is x(timeSeconds[k]), each of length n
 * @param output output[k] is y(timeSeconds[k]) = cOut x
 * @param control control[k] is u(timeSeconds[k]) = cControl x + dControl r; control[0] is the
 *     value just after the step, u(0+) = dControl r
 */
public record StepResponse(double[] timeSeconds, double[][] state, double[] output,
                           double[] control) {

    public StepResponse {
        if (timeSeconds == null || state == null || output == null || control == null) {
            throw new IllegalArgumentException("arrays must not be null");
        }
        int count = timeSeconds.length;
        if (count < 2 || state.length != count || output.length != count
            || control.length != count) {
            throw new IllegalArgumentException("need at least 2 samples and equal lengths, got time "
                + count + ", state " + state.length + ", output " + output.length + ", control "
                + control.length);
        }
        int n = state[0] == null ? 0 : state[0].length;
        if (n < 1) {
            throw new IllegalArgumentException("state vectors must be non-empty");
        }
        double[][] stateCopy = new double[count][];
        for (int k = 0; k < count; k++) {
            if (state[k] == null || state[k].length != n) {
                throw new IllegalArgumentException("state[" + k + "] must have length " + n);
            }
            stateCopy[k] = state[k].clone();
            requireFiniteRow(stateCopy[k], k);
            if (k > 0 && !(timeSeconds[k] > timeSeconds[k - 1])) {
                throw new IllegalArgumentException("timeSeconds must be strictly increasing at " + k);
            }
        }
        timeSeconds = timeSeconds.clone();
        output = output.clone();
        control = control.clone();
        requireFinite(timeSeconds, "timeSeconds");
        requireFinite(output, "output");
        requireFinite(control, "control");
        state = stateCopy;
    }

    /** Same check and message as requireFinite(values, "state[k]"), without building the name per row. */
    private static void requireFiniteRow(double[] values, int row) {
        for (double value : values) {
            if (!Double.isFinite(value)) {
                requireFinite(values, "state[" + row + "]");
            }
        }
    }

    private static void requireFinite(double[] values, String name) {
        for (int i = 0; i < values.length; i++) {
            if (!Double.isFinite(values[i])) {
                throw new IllegalArgumentException(name + "[" + i + "] is not finite: " + values[i]);
            }
        }
    }

    @Override
    public double[] timeSeconds() {
        return timeSeconds.clone();
    }

    /** Returns a deep copy of the states. */
    @Override
    public double[][] state() {
        double[][] copy = new double[state.length][];
        for (int k = 0; k < state.length; k++) {
            copy[k] = state[k].clone();
        }
        return copy;
    }

    @Override
    public double[] output() {
        return output.clone();
    }

    @Override
    public double[] control() {
        return control.clone();
    }

    /** Number of samples. */
    public int sampleCount() {
        return timeSeconds.length;
    }

    /** Copy of the state at sample k. */
    public double[] stateAt(int sampleIndex) {
        if (sampleIndex < 0 || sampleIndex >= state.length) {
            throw new IllegalArgumentException("sample index " + sampleIndex + " outside [0, "
                + (state.length - 1) + "]");
        }
        return state[sampleIndex].clone();
    }
}
