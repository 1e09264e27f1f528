package com.loopwright.solver.simulation;

import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.linalg.TwoByTwoSpectrum;
import java.util.function.BiFunction;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Rise time, settling time, overshoot, peak time, steady-state error and peak control of a
 * {@link LinearLoop}'s step response, exact up to rounding and independent of the sample count.
 *
 * <p>The samples of {@link StepSimulator} only locate events; each event is then refined on the
 * exact continuous solution between samples by Brent's method, with
 * x(t_k + tau) = x_inf + e^(A tau) (x_k - x_inf) and a closed-form 2 x 2 exponential for n = 2,
 * x(t_k + tau) = Ad(tau) x_k + Bd(tau) r (the zero-order hold over tau) otherwise: level
 * crossings as roots of y(t) - level, extrema as roots of y'(t) = cOut (A x + bRef r). The output
 * is normalised as z = y / y_inf, so the metrics hold for either sign of y_inf.
 *
 * <p>The refinement assumes at most one extremum per sample interval. It is enforced for the
 * oscillatory modes: the sample period h must satisfy h max|Im lambda(A)| <= pi / 2 (at least 4
 * samples per period of the fastest oscillation). Sums of real modes have at most n - 1
 * extrema in total, so they are not checked.
 *
 * <p>All metrics are those of the response on [0, horizon]: a peak or a band excursion after the
 * horizon is not seen, so the horizon must cover the slow modes (several times
 * 1 / min |Re lambda(A)|).
 */
public final class StepResponseMetrics {

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
    public StepMetrics measure(
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
        // z = y / y_inf: z(0) = 0, z -> 1; and u. The simulator streams their sample values and
        // rates into the scans, which keep only the intervals that may hold events.
        StepMetricsScan scan = new StepMetricsScan(
                loop,
                stepSize,
                horizonSeconds,
                samples,
                normalisedOutputWeights,
                RISE_START_FRACTION,
                RISE_END_FRACTION,
                settlingBandFraction,
                propagators);
        StepSimulator.stream(loop, stepSize, horizonSeconds, samples, normalisedOutputWeights, scan);
        scan.throwDeferred();

        double riseStart = scan.riseStartSeconds();
        double riseEnd = scan.riseEndSeconds();
        if (riseStart < 0.0 || riseEnd < 0.0) {
            throw new HorizonTooShortException(
                    "the output does not reach 90% of its final value " + finalValue, horizonSeconds);
        }
        double settlingTimeSeconds = scan.settlingSeconds();
        if (settlingTimeSeconds < 0.0) {
            throw new HorizonTooShortException(
                    "the output is outside the " + settlingBandFraction + " settling band at the horizon",
                    horizonSeconds);
        }
        MaximumScan.Point peak = scan.outputMaximum();
        double overshootPercent = Math.max(0.0, 100.0 * (peak.value() - 1.0));

        // max |u| = max(max u, max -u), both including u(0+) = dControl r at sample 0.
        MaximumScan.Point controlMax = scan.controlMaximum();
        MaximumScan.Point controlMin = scan.controlMinimumNegated();
        double peakControl = Math.max(Math.abs(controlMax.value()), Math.abs(controlMin.value()));

        // undershoot: the largest excursion of z opposite to the final value, refined between
        // samples like the overshoot (z(0) = 0 is a sample, so it is never negative)
        double undershootPercent =
                Math.max(0.0, 100.0 * scan.outputMinimumNegated().value());

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
}
