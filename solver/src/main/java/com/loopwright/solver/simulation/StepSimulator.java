package com.loopwright.solver.simulation;

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
    public StepResponse simulate(LinearLoop loop, double stepSize, double horizonSeconds, int samples) {
        return sample(loop, stepSize, horizonSeconds, samples);
    }

    /**
     * The recursion behind {@link #simulate}: fills fresh arrays and hands them to the
     * {@link StepResponse} without a copy. Per step, x[k+1]_i = (Bd_i r + sum_j Ad_ij x[k]_j), in
     * that order of summation ({@link TwoStateRecursion} for n = 2, {@link StateRecursion} otherwise);
     * nothing is allocated per sample.
     *
     * <p>Finiteness is checked once at the end: a non-finite state makes every later output
     * non-finite (c x_j is Inf or NaN for any c, and Inf or NaN never returns to a finite value
     * through Ad), so a running sum of y + u is non-finite exactly when some y or u is, up to a
     * harmless false alarm when the finite sum itself overflows. Only then are the samples scanned
     * for the first bad one, which is reported as before.
     */
    static StepResponse sample(LinearLoop loop, double stepSize, double horizonSeconds, int samples) {
        validate(loop, stepSize, horizonSeconds, samples);
        int n = loop.stateDimension();
        double samplePeriod = horizonSeconds / (samples - 1);
        DiscreteStateSpace discrete = ZeroOrderHold.discretize(loop.a(), loop.bRef(), samplePeriod);
        // Row-major data of fresh copies (DiscreteStateSpace and LinearLoop return copies).
        double[] ad = discrete.ad().data;
        double[] bd = discrete.bd().data;
        double[] cOut = loop.cOut().data;
        double[] cControl = loop.cControl().data;
        double feedthrough = loop.dControl() * stepSize;
        double[] drive = new double[n];
        for (int i = 0; i < n; i++) {
            drive[i] = bd[i] * stepSize;
        }

        double[] timeSeconds = new double[samples];
        double[] state = new double[samples * n];
        double[] output = new double[samples];
        double[] control = new double[samples];
        // t_k = horizon k / (samples - 1); the last sample is exactly the horizon
        double intervals = samples - 1;
        double guard = n == 2
                ? new TwoStateRecursion(ad, drive, cOut, cControl, feedthrough).run(samples, (k, x0, x1, y, u) -> {
                    timeSeconds[k] = horizonSeconds * (k / intervals);
                    state[2 * k] = x0;
                    state[2 * k + 1] = x1;
                    output[k] = y;
                    control[k] = u;
                })
                : new StateRecursion(n, ad, drive, cOut, cControl, feedthrough).run(samples, (k, x, y, u) -> {
                    timeSeconds[k] = horizonSeconds * (k / intervals);
                    System.arraycopy(x, 0, state, k * n, n);
                    output[k] = y;
                    control[k] = u;
                });
        if (!Double.isFinite(guard)) {
            reportFirstOverflow(n, timeSeconds, state, output, control);
        }
        for (int k = 1; k < samples; k++) {
            if (!(timeSeconds[k] > timeSeconds[k - 1])) {
                // The check and message StepResponse applies.
                throw new IllegalArgumentException("timeSeconds must be strictly increasing at " + k);
            }
        }
        return StepResponse.owning(timeSeconds, state, n, output, control);
    }

    /**
     * The samples the step metrics read, handed to the sink one at a time and kept nowhere, with
     * the checks and exceptions of {@link #sample}: x_k exactly as in
     * {@link StepResponse#stateRowMajor()}, u_k exactly as in {@link StepResponse#control()}, and
     * the value and rate of z = w . x (sums in the order {@link StepSampleSink} states). For n = 2
     * the recursion ({@link TwoStateRecursion}) keeps x_k in locals. Finiteness and the sample times are checked after the
     * pass, as {@link #sample} does, so the sink may see non-finite samples before the exception;
     * it must defer its own failures until this method returns.
     */
    static void stream(
            LinearLoop loop,
            double stepSize,
            double horizonSeconds,
            int samples,
            double[] outputWeights,
            StepSampleSink sink) {
        validate(loop, stepSize, horizonSeconds, samples);
        int n = loop.stateDimension();
        double samplePeriod = horizonSeconds / (samples - 1);
        DiscreteStateSpace discrete = ZeroOrderHold.discretize(loop.a(), loop.bRef(), samplePeriod);
        double[] ad = discrete.ad().data;
        double[] bd = discrete.bd().data;
        double[] a = loop.a().data;
        double[] bRef = loop.bRef().data;
        double[] cOut = loop.cOut().data;
        double[] cControl = loop.cControl().data;
        double feedthrough = loop.dControl() * stepSize;
        double[] drive = new double[n];
        double[] rateDrive = new double[n];
        for (int i = 0; i < n; i++) {
            drive[i] = bd[i] * stepSize;
            rateDrive[i] = bRef[i] * stepSize;
        }
        double guard = n == 2
                ? streamTwoStates(
                        new TwoStateRecursion(ad, drive, cOut, cControl, feedthrough),
                        samples,
                        a,
                        rateDrive,
                        cControl,
                        outputWeights,
                        sink)
                : streamAnyStates(
                        new StateRecursion(n, ad, drive, cOut, cControl, feedthrough),
                        n,
                        samples,
                        a,
                        rateDrive,
                        cControl,
                        outputWeights,
                        sink);
        if (!Double.isFinite(guard)) {
            replayFirstOverflow(
                    new StateRecursion(n, ad, drive, cOut, cControl, feedthrough), n, horizonSeconds, samples);
        }
        // t_k = fl(horizon fl(k / (samples - 1))): the quotients grow by about 1 / (samples - 1)
        // >= 1e-5, far above their rounding, so the times can only repeat where the spacing h is
        // subnormal and products round to a few multiples of the smallest double. Only then are
        // they checked one by one, with the message of sample().
        if (!(samplePeriod >= Double.MIN_NORMAL)) {
            double intervals = samples - 1;
            double previous = 0.0;
            for (int k = 1; k < samples; k++) {
                double t = horizonSeconds * (k / intervals);
                if (!(t > previous)) {
                    throw new IllegalArgumentException("timeSeconds must be strictly increasing at " + k);
                }
                previous = t;
            }
        }
    }

    /**
     * The streaming pass for n = 2 on the unrolled recursion: rates x' = A x + bRef r in locals; x_k goes to one of
     * two arrays by the parity of k, so it survives the next call. Returns the running sum of y + u.
     */
    private static double streamTwoStates(
            TwoStateRecursion recursion,
            int samples,
            double[] a,
            double[] rateDrive,
            double[] cControl,
            double[] outputWeights,
            StepSampleSink sink) {
        double a00 = a[0];
        double a01 = a[1];
        double a10 = a[2];
        double a11 = a[3];
        double rateDrive0 = rateDrive[0];
        double rateDrive1 = rateDrive[1];
        double k0 = cControl[0];
        double k1 = cControl[1];
        double w0 = outputWeights[0];
        double w1 = outputWeights[1];
        double[] even = new double[2];
        double[] odd = new double[2];
        return recursion.run(samples, (k, x0, x1, y, u) -> {
            double rate0 = rateDrive0 + a00 * x0 + a01 * x1;
            double rate1 = rateDrive1 + a10 * x0 + a11 * x1;
            double[] state = (k & 1) == 0 ? even : odd;
            state[0] = x0;
            state[1] = x1;
            sink.accept(
                    k, state, 0.0 + w0 * x0 + w1 * x1, 0.0 + w0 * rate0 + w1 * rate1, u, 0.0 + k0 * rate0 + k1 * rate1);
        });
    }

    /** The streaming pass for any n: the same sums as for n = 2, in loops. Returns the running sum of y + u. */
    private static double streamAnyStates(
            StateRecursion recursion,
            int n,
            int samples,
            double[] a,
            double[] rateDrive,
            double[] cControl,
            double[] outputWeights,
            StepSampleSink sink) {
        return recursion.run(samples, (k, state, y, u) -> {
            double value = 0.0;
            double rate = 0.0;
            double controlRate = 0.0;
            for (int i = 0; i < n; i++) {
                value += outputWeights[i] * state[i];
                double component = rateDrive[i];
                int aRow = i * n;
                for (int j = 0; j < n; j++) {
                    component += a[aRow + j] * state[j];
                }
                rate += outputWeights[i] * component;
                controlRate += cControl[i] * component;
            }
            sink.accept(k, state, value, rate, u, controlRate);
        });
    }

    /**
     * Runs the recursion of {@link #stream} again (the same operations, so the same numbers) to
     * throw for its first non-finite sample as {@link #reportFirstOverflow} does; returns on a
     * false alarm.
     */
    private static void replayFirstOverflow(StateRecursion recursion, int n, double horizonSeconds, int samples) {
        double intervals = samples - 1;
        recursion.run(samples, (k, state, y, u) -> {
            double timeSeconds = horizonSeconds * (k / intervals);
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(state[i])) {
                    throw new IllegalArgumentException("response overflows double precision at t = " + timeSeconds
                            + " s: the loop diverges over this horizon");
                }
            }
            if (!Double.isFinite(y) || !Double.isFinite(u)) {
                throw new IllegalArgumentException(
                        "output or control overflows double precision at t = " + timeSeconds + " s");
            }
        });
    }

    /** Throws for the first non-finite sample, states before outputs; returns on a false alarm. */
    private static void reportFirstOverflow(
            int n, double[] timeSeconds, double[] state, double[] output, double[] control) {
        for (int k = 0; k < timeSeconds.length; k++) {
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(state[k * n + i])) {
                    throw new IllegalArgumentException("response overflows double precision at t = " + timeSeconds[k]
                            + " s: the loop diverges over this horizon");
                }
            }
            if (!Double.isFinite(output[k]) || !Double.isFinite(control[k])) {
                throw new IllegalArgumentException(
                        "output or control overflows double precision at t = " + timeSeconds[k] + " s");
            }
        }
    }

    static void validate(LinearLoop loop, double stepSize, double horizonSeconds, int samples) {
        if (loop == null) {
            throw new IllegalArgumentException("loop must not be null");
        }
        if (!Double.isFinite(stepSize)) {
            throw new IllegalArgumentException("stepSize must be finite, got " + stepSize);
        }
        if (!(horizonSeconds > 0.0) || !Double.isFinite(horizonSeconds)) {
            throw new IllegalArgumentException("horizonSeconds must be finite and positive, got " + horizonSeconds);
        }
        if (samples < MIN_SAMPLES || samples > MAX_SAMPLES) {
            throw new IllegalArgumentException(
                    "samples must be in [" + MIN_SAMPLES + ", " + MAX_SAMPLES + "], got " + samples);
        }
        if (!(horizonSeconds / (samples - 1) > 0.0)) {
            throw new IllegalArgumentException(
                    "sample period underflows: horizon " + horizonSeconds + " s over " + (samples - 1) + " intervals");
        }
    }
}
