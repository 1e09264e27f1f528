package com.loopwright.solver.simulation;

import org.ejml.data.DMatrixRMaj;

/**
 * Samples the response of a {@link LinearLoop} to a reference step r applied at t = 0 from
 * x(0) = 0.
 *
 * <p>The reference is constant, so the zero-order-hold recursion is exact at the samples:
 * x[k+1] = Ad x[k] + Bd r with Ad = e^(A h), Bd = integral_0^h e^(A s) ds bRef and
 * h = horizon / (samples - 1). No integration error is made; only rounding accumulates.
 */
public final class StepSimulator {

    /** Smallest accepted number of samples (t = 0 and t = horizon). */
    public static final int MIN_SAMPLES = 2;

    /** Largest accepted number of samples. */
    public static final int MAX_SAMPLES = 100_000;

    /**
     * Simulates the step response on {@code samples} uniform points from 0 to the horizon.
     *
     * @param loop the loop
     * @param stepSize amplitude r of the reference step, in output units (not an integration
     *     step: the recursion is exact); finite
     * @param horizonSeconds last sample time in seconds, finite and positive
     * @param samples number of sample points, in [{@value #MIN_SAMPLES}, {@value #MAX_SAMPLES}]
     * @throws IllegalArgumentException on bad arguments, or if the response overflows double
     *     precision within the horizon (an unstable loop over a long horizon)
     */
    public StepResponse simulate(LinearLoop loop, double stepSize, double horizonSeconds,
                                 int samples) {
        Samples raw = sample(loop, stepSize, horizonSeconds, samples);
        return new StepResponse(raw.timeSeconds(), raw.state(), raw.output(), raw.control());
    }

    /**
     * The arrays of {@link #simulate}, with the same checks and exceptions, but handed over without the
     * defensive copies of a {@link StepResponse}: for callers in this package that only read them.
     */
    static Samples sample(LinearLoop loop, double stepSize, double horizonSeconds, int samples) {
        validate(loop, stepSize, horizonSeconds, samples);
        int n = loop.stateDimension();
        double samplePeriodSeconds = horizonSeconds / (samples - 1);
        DiscreteStateSpace discrete =
            ZeroOrderHold.discretize(loop.a(), loop.bRef(), samplePeriodSeconds);
        DMatrixRMaj ad = discrete.ad();
        DMatrixRMaj bd = discrete.bd();
        DMatrixRMaj cOut = loop.cOut();
        DMatrixRMaj cControl = loop.cControl();
        double feedthrough = loop.dControl() * stepSize;

        double[] timeSeconds = new double[samples];
        double[][] state = new double[samples][n];
        double[] output = new double[samples];
        double[] control = new double[samples];
        for (int k = 0; k < samples; k++) {
            // t_k = horizon k / (samples - 1); the last sample is exactly the horizon.
            timeSeconds[k] = horizonSeconds * ((double) k / (samples - 1));
            if (k > 0) {
                double[] previous = state[k - 1];
                for (int i = 0; i < n; i++) {
                    double sum = bd.unsafe_get(i, 0) * stepSize;
                    for (int j = 0; j < n; j++) {
                        sum += ad.unsafe_get(i, j) * previous[j];
                    }
                    if (!Double.isFinite(sum)) {
                        throw new IllegalArgumentException("response overflows double precision at t = "
                            + timeSeconds[k] + " s: the loop diverges over this horizon");
                    }
                    state[k][i] = sum;
                }
            }
            double y = 0.0;
            double u = feedthrough;
            for (int j = 0; j < n; j++) {
                y += cOut.unsafe_get(0, j) * state[k][j];
                u += cControl.unsafe_get(0, j) * state[k][j];
            }
            if (!Double.isFinite(y) || !Double.isFinite(u)) {
                throw new IllegalArgumentException("output or control overflows double precision at t = "
                    + timeSeconds[k] + " s");
            }
            output[k] = y;
            control[k] = u;
        }
        for (int k = 1; k < samples; k++) {
            if (!(timeSeconds[k] > timeSeconds[k - 1])) {
                // The check and message StepResponse applies.
                throw new IllegalArgumentException("timeSeconds must be strictly increasing at " + k);
            }
        }
        return new Samples(timeSeconds, state, output, control);
    }

    /** Sample arrays owned by the receiver (not copied). */
    record Samples(double[] timeSeconds, double[][] state, double[] output, double[] control) {
    }

    static void validate(LinearLoop loop, double stepSize, double horizonSeconds, int samples) {
        if (loop == null) {
            throw new IllegalArgumentException("loop must not be null");
        }
        if (!Double.isFinite(stepSize)) {
            throw new IllegalArgumentException("stepSize must be finite, got " + stepSize);
        }
        if (!(horizonSeconds > 0.0) || !Double.isFinite(horizonSeconds)) {
            throw new IllegalArgumentException(
                "horizonSeconds must be finite and positive, got " + horizonSeconds);
        }
        if (samples < MIN_SAMPLES || samples > MAX_SAMPLES) {
            throw new IllegalArgumentException("samples must be in [" + MIN_SAMPLES + ", "
                + MAX_SAMPLES + "], got " + samples);
        }
        if (!(horizonSeconds / (samples - 1) > 0.0)) {
            throw new IllegalArgumentException("sample period underflows: horizon " + horizonSeconds
                + " s over " + (samples - 1) + " intervals");
        }
    }
}
