package com.loopwright.solver.simulation;

import java.util.Arrays;

/**
 * Samples of a loop's response to a reference step, on a uniform time grid.
 *
 * <p>The states are held as one row-major array of sampleCount x stateDimension entries:
 * x_i(t_k) is entry k n + i. The public constructor copies and validates its arguments and every
 * accessor returning an array returns a copy, so instances are immutable.
 *
 * <p>timeSeconds: sample times, from 0 to the horizon inclusive, strictly increasing; output[k]
 * is y(t_k) = cOut x; control[k] is u(t_k) = cControl x + dControl r, where control[0] is the
 * value just after the step, u(0+) = dControl r.
 */
public final class StepResponse {

    private final double[] timeSeconds;
    private final double[] stateRowMajor;
    private final int stateDimension;
    private final double[] output;
    private final double[] control;

    /**
     * Copies and validates the samples.
     *
     * @param timeSeconds sample times, at least 2, finite and strictly increasing
     * @param stateRowMajor the states row by row: x_i(t_k) at index k stateDimension + i; finite,
     *     of length timeSeconds.length stateDimension
     * @param stateDimension number n >= 1 of states
     * @param output y(t_k), finite, one per sample
     * @param control u(t_k), finite, one per sample
     * @throws IllegalArgumentException on null, mismatched, non-finite or non-increasing input
     */
    public StepResponse(
            double[] timeSeconds, double[] stateRowMajor, int stateDimension, double[] output, double[] control) {
        if (timeSeconds == null || stateRowMajor == null || output == null || control == null) {
            throw new IllegalArgumentException("arrays must not be null");
        }
        if (stateDimension < 1) {
            throw new IllegalArgumentException("state dimension must be >= 1, got " + stateDimension);
        }
        int count = timeSeconds.length;
        if (count < 2 || output.length != count || control.length != count) {
            throw new IllegalArgumentException("need at least 2 samples and equal lengths, got time " + count
                    + ", output " + output.length + ", control " + control.length);
        }
        if (stateRowMajor.length != (long) count * stateDimension) {
            throw new IllegalArgumentException(
                    "states must hold " + count + " x " + stateDimension + " entries, got " + stateRowMajor.length);
        }
        double[] timeCopy = timeSeconds.clone();
        double[] stateCopy = stateRowMajor.clone();
        double[] outputCopy = output.clone();
        double[] controlCopy = control.clone();
        for (int k = 0; k < count; k++) {
            for (int i = 0; i < stateDimension; i++) {
                double value = stateCopy[k * stateDimension + i];
                if (!Double.isFinite(value)) {
                    throw new IllegalArgumentException("state[" + k + "][" + i + "] is not finite: " + value);
                }
            }
            if (k > 0 && !(timeCopy[k] > timeCopy[k - 1])) {
                throw new IllegalArgumentException("timeSeconds must be strictly increasing at " + k);
            }
        }
        requireFinite(timeCopy, "timeSeconds");
        requireFinite(outputCopy, "output");
        requireFinite(controlCopy, "control");
        this.timeSeconds = timeCopy;
        this.stateRowMajor = stateCopy;
        this.stateDimension = stateDimension;
        this.output = outputCopy;
        this.control = controlCopy;
    }

    private StepResponse(
            int stateDimension, double[] timeSeconds, double[] stateRowMajor, double[] output, double[] control) {
        this.timeSeconds = timeSeconds;
        this.stateRowMajor = stateRowMajor;
        this.stateDimension = stateDimension;
        this.output = output;
        this.control = control;
    }

    /**
     * Takes the arrays over without copying or checking: for {@link StepSimulator}, which has
     * already checked them and never touches them again.
     */
    static StepResponse owning(
            double[] timeSeconds, double[] stateRowMajor, int stateDimension, double[] output, double[] control) {
        return new StepResponse(stateDimension, timeSeconds, stateRowMajor, output, control);
    }

    private static void requireFinite(double[] values, String name) {
        for (int i = 0; i < values.length; i++) {
            if (!Double.isFinite(values[i])) {
                throw new IllegalArgumentException(name + "[" + i + "] is not finite: " + values[i]);
            }
        }
    }

    /** Number of samples. */
    public int sampleCount() {
        return timeSeconds.length;
    }

    /** Number n of states. */
    public int stateDimension() {
        return stateDimension;
    }

    /** Copy of the sample times [s]. */
    public double[] timeSeconds() {
        return timeSeconds.clone();
    }

    /** Copy of the outputs y(t_k). */
    public double[] output() {
        return output.clone();
    }

    /** Copy of the controls u(t_k). */
    public double[] control() {
        return control.clone();
    }

    /** Copy of the states, row-major: x_i(t_k) at index k stateDimension() + i. */
    public double[] stateRowMajor() {
        return stateRowMajor.clone();
    }

    /** t_k in seconds. */
    public double timeAt(int sampleIndex) {
        checkSample(sampleIndex);
        return timeSeconds[sampleIndex];
    }

    /** y(t_k). */
    public double outputAt(int sampleIndex) {
        checkSample(sampleIndex);
        return output[sampleIndex];
    }

    /** u(t_k). */
    public double controlAt(int sampleIndex) {
        checkSample(sampleIndex);
        return control[sampleIndex];
    }

    /** x_i(t_k). */
    public double state(int sampleIndex, int stateIndex) {
        checkSample(sampleIndex);
        if (stateIndex < 0 || stateIndex >= stateDimension) {
            throw new IllegalArgumentException(
                    "state index " + stateIndex + " outside [0, " + (stateDimension - 1) + "]");
        }
        return stateRowMajor[sampleIndex * stateDimension + stateIndex];
    }

    /** Copy of the state x(t_k), of length n. */
    public double[] stateAt(int sampleIndex) {
        checkSample(sampleIndex);
        int from = sampleIndex * stateDimension;
        return Arrays.copyOfRange(stateRowMajor, from, from + stateDimension);
    }

    private void checkSample(int sampleIndex) {
        if (sampleIndex < 0 || sampleIndex >= timeSeconds.length) {
            throw new IllegalArgumentException(
                    "sample index " + sampleIndex + " outside [0, " + (timeSeconds.length - 1) + "]");
        }
    }

    /** Row-major states without a copy, for readers in this package that never modify them. */
    double[] sharedStateRowMajor() {
        return stateRowMajor;
    }

    /** Equal when every array holds the same values (compared as by {@link Arrays#equals}). */
    @Override
    public boolean equals(Object other) {
        return other instanceof StepResponse that
                && stateDimension == that.stateDimension
                && Arrays.equals(timeSeconds, that.timeSeconds)
                && Arrays.equals(stateRowMajor, that.stateRowMajor)
                && Arrays.equals(output, that.output)
                && Arrays.equals(control, that.control);
    }

    @Override
    public int hashCode() {
        int hash = stateDimension;
        hash = 31 * hash + Arrays.hashCode(timeSeconds);
        hash = 31 * hash + Arrays.hashCode(stateRowMajor);
        hash = 31 * hash + Arrays.hashCode(output);
        return 31 * hash + Arrays.hashCode(control);
    }

    @Override
    public String toString() {
        return "StepResponse[" + timeSeconds.length + " samples of " + stateDimension + " states, t = 0 .. "
                + timeSeconds[timeSeconds.length - 1] + " s]";
    }
}
