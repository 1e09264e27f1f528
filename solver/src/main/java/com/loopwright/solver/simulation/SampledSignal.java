package com.loopwright.solver.simulation;

/**
 * The sample values s_k = offset + w . x_k and rates s'_k = w . (A x_k + bRef r) of a scalar
 * signal of the state, recorded by {@link StepSimulator} during its recursion (for n = 2, while
 * x_k is in registers) or in one pass after it. Both are summed in a fixed order: the offset
 * first, then w_i x_i for i = 0 .. n - 1; (bRef_i r + sum_j a_ij x_j) per component, then
 * 0 + sum_i w_i (that) for the rate. Package-private and filled once; the arrays are handed to a
 * {@link LinearSignal} without copies.
 */
final class SampledSignal {

    private final double[] weights;
    private final double offset;
    private double[] values;
    private double[] rates;

    SampledSignal(double[] weights, double offset) {
        this.weights = weights.clone();
        this.offset = offset;
    }

    double[] weights() {
        return weights.clone();
    }

    double offset() {
        return offset;
    }

    double weight(int i) {
        return weights[i];
    }

    /** Makes room for the given number of samples; returns the value array to fill. */
    double[] allocateValues(int samples) {
        values = new double[samples];
        rates = new double[samples];
        return values;
    }

    double[] rateArray() {
        return rates;
    }

    double[] valueArray() {
        return values;
    }

    /** The pass for any n over row-major states, for a loop x' = a x + bRef r. */
    void fill(double[] state, int n, double[] a, double[] bRef, double reference) {
        int samples = state.length / n;
        allocateValues(samples);
        for (int k = 0; k < samples; k++) {
            int row = k * n;
            double value = offset;
            double rate = 0.0;
            for (int i = 0; i < n; i++) {
                value += weights[i] * state[row + i];
                double component = bRef[i] * reference;
                int aRow = i * n;
                for (int j = 0; j < n; j++) {
                    component += a[aRow + j] * state[row + j];
                }
                rate += weights[i] * component;
            }
            values[k] = value;
            rates[k] = rate;
        }
    }
}
