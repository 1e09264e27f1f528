package com.loopwright.solver.simulation;

import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.linalg.TwoByTwoSpectrum;
import com.loopwright.solver.numeric.BracketedRoot;
import java.util.function.BiFunction;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * The previous, array-based implementation of {@link StepResponseMetrics#measure}, kept in the
 * test tree as an oracle for the streaming scans: {@code sampleForMetrics} records all samples
 * (states, values and rates of z and u), then {@link LinearSignal} scans them. Copied verbatim
 * (only made nested and static); do not "improve" it, its value is that it is the old code.
 */
final class ArrayStepMetricsOracle {

    /** Largest accepted h max|Im lambda(A)| (rad): at least 4 samples per oscillation period. */
    public static final double MAX_RADIANS_PER_SAMPLE = Math.PI / 2.0;

    private static final double RISE_START_FRACTION = 0.1;
    private static final double RISE_END_FRACTION = 0.9;

    /**
     * Measures the step response metrics.
     *
     * @param loop the loop; its A must be Hurwitz (every eigenvalue with negative real part)
     * @param stepSize amplitude r of the reference step, in output units; finite, non-zero
     * @param horizonSeconds simulated window in seconds, finite and positive
     * @param samples sample count in [2, 100000]; only locates events, the metrics do not depend
     *     on it once the sample-density condition holds
     * @param settlingBandFraction settling band as a fraction of |y_inf|, in (0, 1), e.g. 0.02
     * @throws IllegalArgumentException on bad arguments, a non-Hurwitz A, a zero final value, or
     *     a sample grid too coarse for the loop's oscillations
     * @throws HorizonTooShortException if the output does not reach 90% of y_inf or is outside the
     *     settling band at the horizon
     */
    StepMetrics measure(
            LinearLoop loop, double stepSize, double horizonSeconds, int samples, double settlingBandFraction) {
        return measure(loop, stepSize, horizonSeconds, samples, settlingBandFraction, SubIntervalPropagator::of);
    }

    /**
     * {@link #measure(LinearLoop, double, double, int, double)} with a chosen propagation between
     * samples (tests compare the closed form for n = 2 with the general zero-order hold).
     */
    StepMetrics measure(
            LinearLoop loop,
            double stepSize,
            double horizonSeconds,
            int samples,
            double settlingBandFraction,
            BiFunction<LinearLoop, Double, SubIntervalPropagator> propagators) {
        StepSimulator.validate(loop, stepSize, horizonSeconds, samples);
        if (stepSize == 0.0) {
            throw new IllegalArgumentException("stepSize must be non-zero");
        }
        if (!(settlingBandFraction > 0.0 && settlingBandFraction < 1.0)) {
            throw new IllegalArgumentException("settlingBandFraction must be in (0, 1), got " + settlingBandFraction);
        }
        double maxOscillationRadPerSecond = requireHurwitz(loop.a());
        double samplePeriod = horizonSeconds / (samples - 1);
        if (samplePeriod * maxOscillationRadPerSecond > MAX_RADIANS_PER_SAMPLE) {
            double needed = Math.ceil(horizonSeconds * maxOscillationRadPerSecond / MAX_RADIANS_PER_SAMPLE) + 1;
            throw new IllegalArgumentException("sample grid too coarse: the fastest oscillation ("
                    + maxOscillationRadPerSecond + " rad/s) needs at least " + (long) needed
                    + " samples over " + horizonSeconds + " s, got " + samples);
        }
        double finalValue = finalValue(loop, stepSize);

        int n = loop.stateDimension();
        DMatrixRMaj cOut = loop.cOut();
        double[] normalisedOutputWeights = new double[n];
        for (int j = 0; j < n; j++) {
            normalisedOutputWeights[j] = cOut.get(0, j) / finalValue;
            if (!Double.isFinite(normalisedOutputWeights[j])) {
                throw new IllegalArgumentException(
                        "cOut / y_inf overflows: final value " + finalValue + " is too close to zero");
            }
        }
        // z = y / y_inf: z(0) = 0, z -> 1; and u. The simulator records their sample values and
        // rates; the states only feed the trajectory, so they are shared, not copied.
        MetricSamples sampled = sampleForMetrics(loop, stepSize, horizonSeconds, samples, normalisedOutputWeights);
        ExactTrajectory trajectory = new ExactTrajectory(
                loop, stepSize, horizonSeconds, sampled.stateRowMajor(), propagators.apply(loop, stepSize));
        LinearSignal normalisedOutput = new LinearSignal(trajectory, sampled.output());

        double riseStart = normalisedOutput.firstTimeReaching(RISE_START_FRACTION);
        double riseEnd = normalisedOutput.firstTimeReaching(RISE_END_FRACTION);
        if (riseStart < 0.0 || riseEnd < 0.0) {
            throw new HorizonTooShortException(
                    "the output does not reach 90% of its final value " + finalValue, horizonSeconds);
        }
        double settlingTimeSeconds = normalisedOutput.lastTimeOutsideBand(1.0, settlingBandFraction);
        if (settlingTimeSeconds < 0.0) {
            throw new HorizonTooShortException(
                    "the output is outside the " + settlingBandFraction + " settling band at the horizon",
                    horizonSeconds);
        }
        LinearSignal.Point peak = normalisedOutput.maximum();
        double overshootPercent = Math.max(0.0, 100.0 * (peak.value() - 1.0));

        // max |u| = max(max u, max -u), both including u(0+) = dControl r at sample 0.
        LinearSignal control = new LinearSignal(trajectory, sampled.control());
        LinearSignal.Point controlMax = control.maximum();
        LinearSignal.Point controlMin = control.maximumOfNegation();
        double peakControl = Math.max(Math.abs(controlMax.value()), Math.abs(controlMin.value()));

        // undershoot: the old code's maximum of the negation, applied to z (added with the streaming
        // undershoot, so the oracle covers it too)
        double undershootPercent =
                Math.max(0.0, 100.0 * normalisedOutput.maximumOfNegation().value());

        return new StepMetrics(
                riseEnd - riseStart,
                settlingTimeSeconds,
                overshootPercent,
                peak.timeSeconds(),
                stepSize - finalValue,
                peakControl,
                finalValue,
                undershootPercent);
    }

    /** Checks Re lambda < 0 for every eigenvalue; returns max |Im lambda| in rad/s (closed form for n = 2). */
    private static double requireHurwitz(DMatrixRMaj a) {
        // Eigenvalues come with errors ~ eps ||A||, so real parts within that of zero are taken
        // as on the imaginary axis.
        double realPartTolerance = 8.0 * Math.ulp(1.0) * NormOps_DDRM.normF(a);
        if (a.numRows == 2) {
            TwoByTwoSpectrum spectrum = TwoByTwoSpectrum.of(a);
            if (!(spectrum.abscissa() < -realPartTolerance)) {
                throw notHurwitz(spectrum.abscissa(), spectrum.maxImaginary());
            }
            return spectrum.maxImaginary();
        }
        EigenDecomposition_F64<DMatrixRMaj> eigen = DecompositionFactory_DDRM.eig(a.numRows, false, false);
        if (!eigen.decompose(a.copy())) {
            throw new IllegalArgumentException("eigenvalues of A could not be computed");
        }
        double maxImaginary = 0.0;
        for (int i = 0; i < eigen.getNumberOfEigenvalues(); i++) {
            Complex_F64 eigenvalue = eigen.getEigenvalue(i);
            if (!(eigenvalue.real < -realPartTolerance)) {
                throw notHurwitz(eigenvalue.real, eigenvalue.imaginary);
            }
            maxImaginary = Math.max(maxImaginary, Math.abs(eigenvalue.imaginary));
        }
        return maxImaginary;
    }

    private static IllegalArgumentException notHurwitz(double real, double imaginary) {
        return new IllegalArgumentException("A is not Hurwitz: eigenvalue " + real
                + (imaginary >= 0 ? " + " : " - ") + Math.abs(imaginary)
                + "i has a non-negative real part, so the step response has no final value");
    }

    /** y_inf = cOut x_inf with A x_inf = -bRef r (the equilibrium of x' = A x + bRef r). */
    private static double finalValue(LinearLoop loop, double stepSize) {
        int n = loop.stateDimension();
        LinearSolverDense<DMatrixRMaj> solver = LinearSolverFactory_DDRM.lu(n);
        if (!solver.setA(loop.a())) {
            throw new IllegalArgumentException("A is singular");
        }
        DMatrixRMaj rhs = loop.bRef();
        for (int i = 0; i < n; i++) {
            rhs.set(i, 0, -rhs.get(i, 0) * stepSize);
        }
        DMatrixRMaj equilibrium = new DMatrixRMaj(n, 1);
        solver.solve(rhs, equilibrium);
        DMatrixRMaj cOut = loop.cOut();
        double finalValue = 0.0;
        for (int j = 0; j < n; j++) {
            finalValue += cOut.get(0, j) * equilibrium.get(j, 0);
        }
        if (!Double.isFinite(finalValue)) {
            throw new IllegalArgumentException("final value is not finite: A is numerically singular");
        }
        if (finalValue == 0.0) {
            throw new IllegalArgumentException(
                    "final value is zero: rise, overshoot and settling relative to it are undefined");
        }
        return finalValue;
    }

    /**
     * The samples the step metrics read, with the checks and exceptions of {@link #sample}: the
     * row-major states and the sample values and rates of the signal with the given output
     * weights and of the control u (whose sample values are u_k exactly as in
     * {@link StepResponse#control()}). For n = 2 they come from one pass of the recursion that
     * keeps no time or output array (times are t_k = horizon (k / (samples - 1)), the same
     * expression, and y is formed only for the finiteness check) and stores u once, as the
     * control signal's values; otherwise from {@link #sample} and a pass over its states.
     */
    static MetricSamples sampleForMetrics(
            LinearLoop loop, double stepSize, double horizonSeconds, int samples, double[] outputWeights) {
        int n = loop.stateDimension();
        SampledSignal outputSignal = new SampledSignal(outputWeights, 0.0);
        SampledSignal controlSignal = new SampledSignal(loop.cControl().data, loop.dControl() * stepSize);
        double[] a = loop.a().data;
        double[] bRef = loop.bRef().data;
        if (n != 2) {
            StepResponse response = StepSimulator.sample(loop, stepSize, horizonSeconds, samples);
            double[] state = response.sharedStateRowMajor();
            outputSignal.fill(state, n, a, bRef, stepSize);
            controlSignal.fill(state, n, a, bRef, stepSize);
            return new MetricSamples(state, outputSignal, controlSignal);
        }
        StepSimulator.validate(loop, stepSize, horizonSeconds, samples);
        double samplePeriod = horizonSeconds / (samples - 1);
        DiscreteStateSpace discrete = ZeroOrderHold.discretize(loop.a(), loop.bRef(), samplePeriod);
        double[] ad = discrete.ad().data;
        double[] bd = discrete.bd().data;
        double[] cOut = loop.cOut().data;
        double[] cControl = loop.cControl().data;
        double feedthrough = loop.dControl() * stepSize;
        double drive0 = bd[0] * stepSize;
        double drive1 = bd[1] * stepSize;
        double ad00 = ad[0];
        double ad01 = ad[1];
        double ad10 = ad[2];
        double ad11 = ad[3];
        double c0 = cOut[0];
        double c1 = cOut[1];
        double k0 = cControl[0];
        double k1 = cControl[1];
        double a00 = a[0];
        double a01 = a[1];
        double a10 = a[2];
        double a11 = a[3];
        double rateDrive0 = bRef[0] * stepSize;
        double rateDrive1 = bRef[1] * stepSize;
        double w0 = outputWeights[0];
        double w1 = outputWeights[1];

        double[] state = new double[2 * samples];
        double[] outputValues = outputSignal.allocateValues(samples);
        double[] outputRates = outputSignal.rateArray();
        double[] control = controlSignal.allocateValues(samples);
        double[] controlRates = controlSignal.rateArray();
        double x0 = 0.0;
        double x1 = 0.0;
        double guard = 0.0;
        double intervals = samples - 1;
        for (int k = 0; k < samples; k++) {
            if (k > 0) {
                double next0 = drive0 + ad00 * x0 + ad01 * x1;
                double next1 = drive1 + ad10 * x0 + ad11 * x1;
                x0 = next0;
                x1 = next1;
            }
            state[2 * k] = x0;
            state[2 * k + 1] = x1;
            double y = 0.0 + c0 * x0 + c1 * x1;
            double u = feedthrough + k0 * x0 + k1 * x1;
            control[k] = u;
            guard += y + u;
            double rate0 = rateDrive0 + a00 * x0 + a01 * x1;
            double rate1 = rateDrive1 + a10 * x0 + a11 * x1;
            outputValues[k] = 0.0 + w0 * x0 + w1 * x1;
            outputRates[k] = 0.0 + w0 * rate0 + w1 * rate1;
            controlRates[k] = 0.0 + k0 * rate0 + k1 * rate1;
        }
        if (!Double.isFinite(guard)) {
            double[] timeSeconds = new double[samples];
            double[] output = new double[samples];
            for (int k = 0; k < samples; k++) {
                timeSeconds[k] = horizonSeconds * (k / intervals);
                output[k] = 0.0 + c0 * state[2 * k] + c1 * state[2 * k + 1];
            }
            reportFirstOverflow(2, timeSeconds, state, output, control);
        }
        // t_k = fl(horizon fl(k / (samples - 1))): the quotients grow by about 1 / (samples - 1)
        // >= 1e-5, far above their rounding, so the times can only repeat where the spacing h is
        // subnormal and products round to a few multiples of the smallest double. Only then are
        // they checked one by one, with the message of sample().
        if (!(samplePeriod >= Double.MIN_NORMAL)) {
            double previous = 0.0;
            for (int k = 1; k < samples; k++) {
                double t = horizonSeconds * (k / intervals);
                if (!(t > previous)) {
                    throw new IllegalArgumentException("timeSeconds must be strictly increasing at " + k);
                }
                previous = t;
            }
        }
        return new MetricSamples(state, outputSignal, controlSignal);
    }

    /** What {@link #sampleForMetrics} returns; arrays owned by the receiver. */
    record MetricSamples(double[] stateRowMajor, SampledSignal output, SampledSignal control) {}

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

    static final class LinearSignal {

        /** A time and the signal value there. */
        record Point(double timeSeconds, double value) {}

        private final ExactTrajectory trajectory;
        private final double[] weights;
        private final double offset;
        private final double[] sampleValue;
        private final double[] sampleRate;
        /** x(t) between samples, reused by every evaluation. */
        private final double[] scratch;

        /** Takes over the recorded samples of a signal along the trajectory's samples. */
        LinearSignal(ExactTrajectory trajectory, SampledSignal samples) {
            if (samples.valueArray() == null || samples.valueArray().length != trajectory.sampleCount()) {
                throw new IllegalArgumentException("the signal was not recorded on this trajectory");
            }
            this.trajectory = trajectory;
            this.weights = samples.weights();
            this.offset = samples.offset();
            this.sampleValue = samples.valueArray();
            this.sampleRate = samples.rateArray();
            this.scratch = new double[trajectory.stateDimension()];
        }

        int sampleCount() {
            return sampleValue.length;
        }

        double sampleValue(int k) {
            return sampleValue[k];
        }

        double time(int k) {
            return trajectory.time(k);
        }

        /** offset + w . x, x at values[from .. from + n). */
        private double valueOf(double[] values, int from) {
            double sum = offset;
            for (int i = 0; i < weights.length; i++) {
                sum += weights[i] * values[from + i];
            }
            return sum;
        }

        /** s(t) for t in [t_k, t_(k+1)]. */
        double valueBetween(int k, double tSeconds) {
            trajectory.stateBetween(k, tSeconds, scratch);
            return valueOf(scratch, 0);
        }

        /** s'(t) for t in [t_k, t_(k+1)]. */
        double rateBetween(int k, double tSeconds) {
            trajectory.stateBetween(k, tSeconds, scratch);
            return trajectory.rateAlong(weights, scratch, 0);
        }

        /** Interval k has an interior maximum: s' goes from positive to negative. */
        boolean hasInteriorMaximum(int k) {
            return sampleRate[k] > 0.0 && sampleRate[k + 1] < 0.0;
        }

        /** Interval k has an interior minimum: s' goes from negative to positive. */
        boolean hasInteriorMinimum(int k) {
            return sampleRate[k] < 0.0 && sampleRate[k + 1] > 0.0;
        }

        /**
         * Upper estimate of an interior maximum on interval k of width h: if s' decreases across the
         * interval, s(t*) <= s_k + s'_k h and s(t*) <= s_(k+1) - s'_(k+1) h; a factor 2 on the
         * increments adds a margin for a non-monotone s'.
         */
        double interiorMaximumBound(int k) {
            double width = time(k + 1) - time(k);
            return Math.min(
                    sampleValue[k] + 2.0 * sampleRate[k] * width, sampleValue[k + 1] - 2.0 * sampleRate[k + 1] * width);
        }

        /** Lower estimate of an interior minimum on interval k, mirror of the maximum bound. */
        double interiorMinimumBound(int k) {
            double width = time(k + 1) - time(k);
            return Math.max(
                    sampleValue[k] + 2.0 * sampleRate[k] * width, sampleValue[k + 1] - 2.0 * sampleRate[k + 1] * width);
        }

        /** The critical point s'(t*) = 0 inside interval k, by Brent's method on the exact s'. */
        Point criticalPoint(int k) {
            double tStar =
                    BracketedRoot.brent(t -> rateBetween(k, t), time(k), time(k + 1), sampleRate[k], sampleRate[k + 1]);
            return new Point(tStar, valueBetween(k, tStar));
        }

        /**
         * The time in [loSeconds, hiSeconds] within interval k where s = level, given the signal
         * values at the bracket ends (they must straddle the level).
         */
        double crossing(int k, double level, double loSeconds, double valueAtLo, double hiSeconds, double valueAtHi) {
            if (loSeconds == hiSeconds) {
                return loSeconds;
            }
            return BracketedRoot.brent(
                    t -> valueBetween(k, t) - level, loSeconds, hiSeconds, valueAtLo - level, valueAtHi - level);
        }

        /**
         * The global maximum of s over [0, horizon]: the largest sample, then every interior maximum
         * whose upper estimate could beat the best value so far, largest estimate first.
         */
        Point maximum() {
            return maximumOf(1.0);
        }

        /**
         * The global maximum of -s, as the time and the value of -s there: the maximum of the signal
         * with weights -w and offset -offset, bit for bit (rounding to nearest is symmetric under
         * negation, so its sample values, rates, bounds and Brent iterates are exactly those of s
         * with the sign changed), without building that signal's arrays.
         */
        Point maximumOfNegation() {
            return maximumOf(-1.0);
        }

        /** The maximum of sign s for sign = +1 or -1 (multiplying by either is exact). */
        private Point maximumOf(double sign) {
            int count = sampleCount();
            // One pass: the largest sample, and every interval with an interior maximum whose bound
            // beats the best sample so far (a superset of those beating the final best, which are
            // kept below). The best value is kept in a local: comparing against
            // sampleValue[bestSample] would make each step wait for a dependent load.
            int bestSample = 0;
            double bestValue = sign * sampleValue[0];
            double previousRate = sign * sampleRate[0];
            int[] candidates = new int[8];
            int candidateCount = 0;
            for (int k = 1; k < count; k++) {
                double rate = sign * sampleRate[k];
                if (previousRate > 0.0 && rate < 0.0 && signedMaximumBound(k - 1, sign) > bestValue) {
                    if (candidateCount == candidates.length) {
                        candidates = java.util.Arrays.copyOf(candidates, 2 * candidateCount);
                    }
                    candidates[candidateCount++] = k - 1;
                }
                previousRate = rate;
                double value = sign * sampleValue[k];
                if (value > bestValue) {
                    bestValue = value;
                    bestSample = k;
                }
            }
            Point best = new Point(time(bestSample), bestValue);
            int kept = 0;
            for (int i = 0; i < candidateCount; i++) {
                if (signedMaximumBound(candidates[i], sign) > bestValue) {
                    kept++;
                }
            }
            if (kept == 0) {
                return best;
            }
            Integer[] order = new Integer[kept];
            for (int i = 0, found = 0; i < candidateCount; i++) {
                if (signedMaximumBound(candidates[i], sign) > bestValue) {
                    order[found++] = candidates[i];
                }
            }
            java.util.Arrays.sort(
                    order, (p, q) -> Double.compare(signedMaximumBound(q, sign), signedMaximumBound(p, sign)));
            for (int k : order) {
                if (signedMaximumBound(k, sign) <= best.value()) {
                    break;
                }
                double tStar = BracketedRoot.brent(
                        t -> sign * rateBetween(k, t),
                        time(k),
                        time(k + 1),
                        sign * sampleRate[k],
                        sign * sampleRate[k + 1]);
                Point refined = new Point(tStar, sign * valueBetween(k, tStar));
                if (refined.value() > best.value()) {
                    best = refined;
                }
            }
            return best;
        }

        /** Interval k has an interior maximum of sign s. */
        private boolean hasInteriorMaximum(int k, double sign) {
            return sign * sampleRate[k] > 0.0 && sign * sampleRate[k + 1] < 0.0;
        }

        /** {@link #interiorMaximumBound} of sign s. */
        private double signedMaximumBound(int k, double sign) {
            double width = time(k + 1) - time(k);
            return Math.min(
                    sign * sampleValue[k] + 2.0 * (sign * sampleRate[k]) * width,
                    sign * sampleValue[k + 1] - 2.0 * (sign * sampleRate[k + 1]) * width);
        }

        /**
         * The first time s reaches the level (s(0) below it), or -1 if it does not within the
         * horizon.
         */
        double firstTimeReaching(double level) {
            if (sampleValue[0] >= level) {
                return time(0);
            }
            for (int k = 0; k < sampleCount() - 1; k++) {
                if (hasInteriorMaximum(k) && interiorMaximumBound(k) >= level) {
                    Point peak = criticalPoint(k);
                    if (peak.value() >= level) {
                        // s rises monotonically from t_k to the peak
                        return crossing(k, level, time(k), sampleValue[k], peak.timeSeconds(), peak.value());
                    }
                }
                if (sampleValue[k + 1] >= level) {
                    return crossing(k, level, time(k), sampleValue[k], time(k + 1), sampleValue[k + 1]);
                }
            }
            return -1.0;
        }

        /**
         * The last time |s - centre| exceeds halfWidth, scanning back from the horizon, or -1 if s is
         * outside the band at the last sample.
         */
        double lastTimeOutsideBand(double centre, double halfWidth) {
            double upper = centre + halfWidth;
            double lower = centre - halfWidth;
            int last = sampleCount() - 1;
            if (Math.abs(sampleValue[last] - centre) > halfWidth) {
                return -1.0;
            }
            for (int k = last - 1; k >= 0; k--) {
                // Exit after an interior extremum outside the band: s is monotone from t* to t_(k+1).
                if (hasInteriorMaximum(k) && interiorMaximumBound(k) > upper) {
                    Point peak = criticalPoint(k);
                    if (peak.value() > upper) {
                        return crossing(k, upper, peak.timeSeconds(), peak.value(), time(k + 1), sampleValue[k + 1]);
                    }
                }
                if (hasInteriorMinimum(k) && interiorMinimumBound(k) < lower) {
                    Point trough = criticalPoint(k);
                    if (trough.value() < lower) {
                        return crossing(
                                k, lower, trough.timeSeconds(), trough.value(), time(k + 1), sampleValue[k + 1]);
                    }
                }
                if (Math.abs(sampleValue[k] - centre) > halfWidth) {
                    double level = sampleValue[k] > centre ? upper : lower;
                    return crossing(k, level, time(k), sampleValue[k], time(k + 1), sampleValue[k + 1]);
                }
            }
            return time(0);
        }
    }

    static final class SampledSignal {

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

    static final class ExactTrajectory {

        private final int n;
        private final double[] a;
        private final double[] bRef;
        private final double reference;
        private final double horizonSeconds;
        private final int sampleCount;
        private final double intervals;
        private final double[] state;
        private final SubIntervalPropagator propagator;

        /**
         * Takes the state array over without copying: the caller must not modify it afterwards.
         *
         * @param horizonSeconds last sample time; t_k = horizon (k / (sampleCount - 1)), the
         *     expression of {@link StepSimulator}
         * @param state row-major samples, x_i(t_k) at k n + i
         */
        ExactTrajectory(
                LinearLoop loop,
                double reference,
                double horizonSeconds,
                double[] state,
                SubIntervalPropagator propagator) {
            DMatrixRMaj aMatrix = loop.a();
            this.n = aMatrix.numRows;
            this.a = aMatrix.data;
            this.bRef = loop.bRef().data;
            this.reference = reference;
            this.horizonSeconds = horizonSeconds;
            this.sampleCount = state.length / n;
            this.intervals = sampleCount - 1;
            this.state = state;
            this.propagator = propagator;
        }

        int sampleCount() {
            return sampleCount;
        }

        int stateDimension() {
            return n;
        }

        double time(int sampleIndex) {
            return horizonSeconds * (sampleIndex / intervals);
        }

        /** Writes x(t) for t in [t_k, t_(k+1)] into target, propagated exactly from sample k. */
        void stateBetween(int sampleIndex, double tSeconds, double[] target) {
            double tau = tSeconds - time(sampleIndex);
            int offset = sampleIndex * n;
            if (tau <= 0.0) {
                System.arraycopy(state, offset, target, 0, n);
                return;
            }
            propagator.propagate(state, offset, tau, target);
        }

        /** w . x' = sum_i w_i (bRef_i r + sum_j a_ij x_j), x at values[offset .. offset + n). */
        double rateAlong(double[] weights, double[] values, int offset) {
            double sum = 0.0;
            for (int i = 0; i < n; i++) {
                double rate = bRef[i] * reference;
                int row = i * n;
                for (int j = 0; j < n; j++) {
                    rate += a[row + j] * values[offset + j];
                }
                sum += weights[i] * rate;
            }
            return sum;
        }
    }
}
