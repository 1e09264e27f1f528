package com.loopwright.solver.fit;

import com.loopwright.solver.spec.NormalizedSettlingTime;
import com.loopwright.solver.spec.OvershootDamping;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.hipparchus.distribution.continuous.TDistribution;
import org.hipparchus.exception.MathIllegalArgumentException;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.util.Pair;

/**
 * Fits K, wn, zeta and optionally the dead time theta and initial offset y0 of
 * y(t) = y0 + K A S(wn (t - t_step - theta); zeta) to a logged step test by Levenberg-Marquardt (Hipparchus),
 * from a few starts read off the data (final value, peak or 50% crossing, 10% crossing). Standard errors come
 * from s^2 (J'J)^-1 at the optimum with s^2 = SSR/(n - p). Stateless and thread-safe.
 */
public final class StepResponseFitter {

    /** Fewest samples accepted (each parameter needs several). */
    public static final int MIN_SAMPLES = 8;
    /** Levenberg-Marquardt iterations per start. */
    public static final int MAX_ITERATIONS = 200;
    /** Model evaluations per start. */
    public static final int MAX_EVALUATIONS = 1000;
    /** Starting points tried (dead-time guesses); the lowest residual wins. */
    public static final int MAX_STARTS = 4;
    /** Largest damping ratio the fit explores (beyond it a second-order model is a first-order one). */
    public static final double MAX_DAMPING_RATIO = 50;
    /** Relative standard error above which a parameter is reported as poorly determined. */
    static final double POORLY_DETERMINED_RELATIVE_ERROR = 0.5;
    /** Residual standard deviation above this fraction of the step change: noise dominates. */
    static final double NOISE_DOMINATES_FRACTION = 0.1;
    /** A step change below this many residual standard deviations cannot be identified. */
    static final double MIN_SIGNAL_TO_NOISE = 3;
    /** Share of post-step samples pinned at the extreme value that indicates a limit (with at least 5). */
    static final double PLATEAU_FRACTION = 0.05;
    /** Samples wanted between the step and the 90% point of the rise. */
    static final int MIN_TRANSIENT_SAMPLES = 10;

    private static final double RANK_THRESHOLD = 1e-14;
    /** Doublings allowed when bracketing the 90% point (wn t beyond 2^60 is never reached for zeta &lt;= 50). */
    private static final int MAX_BRACKET_DOUBLINGS = 60;
    /** Bisection steps on the 90% point (enough to reach double precision from any bracket). */
    private static final int BISECTION_STEPS = 100;

    private final int maxIterations;

    public StepResponseFitter() {
        this(MAX_ITERATIONS);
    }

    /** A fitter with a lower iteration cap per start (tests of the non-convergence path). */
    StepResponseFitter(int maxIterations) {
        if (maxIterations < 1 || maxIterations > MAX_ITERATIONS) {
            throw new IllegalArgumentException("iteration cap must be from 1 to " + MAX_ITERATIONS);
        }
        this.maxIterations = maxIterations;
    }

    public StepFit fit(StepTestData data, FitOptions options) {
        int n = data.size();
        int p = 3 + (options.estimateDeadTime() ? 1 : 0) + (options.estimateInitialOffset() ? 1 : 0);
        if (n < Math.max(MIN_SAMPLES, p + 3)) {
            throw new FitFailedException("only " + n + " samples: at least " + Math.max(MIN_SAMPLES, p + 3)
                    + " are needed to fit " + p + " parameters");
        }
        double[] t = data.timeSeconds();
        double[] y = data.output();
        int afterStep = firstIndexAtOrAfter(t, data.stepTimeSeconds());
        if (n - afterStep < p + 2) {
            throw new FitFailedException("fewer than " + (p + 2) + " samples after the step at t = "
                    + data.stepTimeSeconds() + " s: the response is not in the record");
        }
        double y0Guess = options.estimateInitialOffset() ? mean(y, 0, Math.max(afterStep, 1)) : 0;
        int tailStart = n - Math.max(1, (n - afterStep) / 10);
        double finalGuess = mean(y, tailStart, n);
        double change = finalGuess - y0Guess;
        double range = max(y, 0, n) - min(y, 0, n);
        if (range == 0 || change == 0) {
            throw new FitFailedException("the output does not move after the step: there is no excitation to"
                    + " identify a model from");
        }
        ResponseModel model = new ResponseModel(data, options);
        List<double[]> starts = starts(t, y, afterStep, data.stepTimeSeconds(), y0Guess, change,
                data.stepAmplitude(), options);
        LeastSquaresOptimizer.Optimum best = null;
        String lastFailure = "no start converged";
        for (double[] start : starts) {
            LeastSquaresProblem problem = new LeastSquaresBuilder()
                    .start(start)
                    .model(model)
                    .target(y)
                    .parameterValidator(point -> model.clamp(point))
                    .maxIterations(maxIterations)
                    .maxEvaluations(MAX_EVALUATIONS)
                    .lazyEvaluation(false)
                    .build();
            try {
                LeastSquaresOptimizer.Optimum optimum = new LevenbergMarquardtOptimizer().optimize(problem);
                if (best == null || optimum.getCost() < best.getCost()) {
                    best = optimum;
                }
            } catch (MathIllegalStateException | MathIllegalArgumentException e) {
                lastFailure = "the least-squares fit did not converge within " + maxIterations
                        + " iterations and " + MAX_EVALUATIONS + " evaluations";
            }
        }
        if (best == null || !Double.isFinite(best.getCost())) {
            throw new FitFailedException(lastFailure + "; the record may not be a second-order step response");
        }
        return summarize(data, options, model, best, n, p, afterStep);
    }

    private StepFit summarize(StepTestData data, FitOptions options, ResponseModel model,
                              LeastSquaresOptimizer.Optimum optimum, int n, int p, int afterStep) {
        double[] point = optimum.getPoint().toArray();
        double[] y = data.output();
        double ssr = 0;
        double[] residuals = optimum.getResiduals().toArray();
        for (double r : residuals) {
            ssr += r * r;
        }
        double meanY = mean(y, 0, n);
        double sst = 0;
        for (double v : y) {
            sst += (v - meanY) * (v - meanY);
        }
        int dof = n - p;
        double s2 = ssr / dof;
        double gain = point[0];
        double wn = point[1];
        double zeta = point[2];
        double theta = options.estimateDeadTime() ? point[3] : 0;
        double y0 = options.estimateInitialOffset() ? point[p - 1] : 0;
        double stepChange = Math.abs(gain * data.stepAmplitude());
        double sigma = Math.sqrt(s2);
        if (!(stepChange > MIN_SIGNAL_TO_NOISE * sigma)) {
            throw new FitFailedException(String.format("the fitted step change %.3g is below %.0f residual"
                    + " standard deviations (%.3g): the noise hides the response, so no model is identified",
                    stepChange, MIN_SIGNAL_TO_NOISE, sigma));
        }
        RealMatrix covariance;
        try {
            covariance = optimum.getCovariances(RANK_THRESHOLD).scalarMultiply(s2);
        } catch (MathIllegalArgumentException e) {
            throw new FitFailedException("the parameters are not identifiable from these samples (the Jacobian at"
                    + " the optimum is singular): record more of the transient or excite the plant harder");
        }
        double quantile = new TDistribution(dof).inverseCumulativeProbability(0.975);
        List<FittedParameter> parameters = new ArrayList<>();
        String[] names = model.names();
        List<FitWarning> warnings = new ArrayList<>();
        for (int i = 0; i < p; i++) {
            double se = Math.sqrt(Math.max(0, covariance.getEntry(i, i)));
            parameters.add(new FittedParameter(names[i], point[i], se, point[i] - quantile * se,
                    point[i] + quantile * se));
            if (i < 3 && se > POORLY_DETERMINED_RELATIVE_ERROR * Math.abs(point[i])) {
                warnings.add(new FitWarning(FitWarning.Code.POORLY_DETERMINED, String.format("%s = %.4g has a"
                        + " standard error of %.0f%% of its value: the data hardly determine it", names[i],
                        point[i], 100 * se / Math.abs(point[i]))));
            }
        }
        warnings.addAll(dataWarnings(data, afterStep, wn, zeta, theta, stepChange, sigma));
        return new StepFit(gain, wn, zeta, theta, y0, parameters, Math.sqrt(ssr / n),
                sst == 0 ? 0 : 1 - ssr / sst, dof, optimum.getIterations(), optimum.getEvaluations(), warnings);
    }

    private static List<FitWarning> dataWarnings(StepTestData data, int afterStep, double wn, double zeta,
                                                 double theta, double stepChange, double sigma) {
        List<FitWarning> warnings = new ArrayList<>();
        double[] t = data.timeSeconds();
        double[] y = data.output();
        int n = t.length;
        double settling;
        try {
            settling = NormalizedSettlingTime.of(zeta, 0.02) / wn;
        } catch (RuntimeException e) {
            settling = Double.POSITIVE_INFINITY;
        }
        double recorded = t[n - 1] - data.stepTimeSeconds() - theta;
        if (!(recorded >= settling)) {
            warnings.add(new FitWarning(FitWarning.Code.RECORD_TOO_SHORT, String.format("the record ends %.3g s"
                    + " after the response starts, before the fitted model settles to 2%% (%.3g s): the final"
                    + " value and the gain are extrapolated", recorded, settling)));
        }
        double riseEnd = data.stepTimeSeconds() + theta + riseTo90(zeta) / wn;
        int inTransient = 0;
        for (int i = afterStep; i < n && t[i] <= riseEnd; i++) {
            inTransient++;
        }
        if (inTransient < MIN_TRANSIENT_SAMPLES) {
            warnings.add(new FitWarning(FitWarning.Code.FEW_SAMPLES_IN_TRANSIENT, "only " + inTransient
                    + " samples fall on the rise to 90%: sample faster to pin down the natural frequency and"
                    + " damping"));
        }
        double top = max(y, afterStep, n);
        double bottom = min(y, afterStep, n);
        int atTop = 0;
        int atBottom = 0;
        for (int i = afterStep; i < n; i++) {
            atTop += y[i] == top ? 1 : 0;
            atBottom += y[i] == bottom ? 1 : 0;
        }
        int plateau = Math.max(atTop, atBottom);
        if (plateau >= 5 && plateau >= PLATEAU_FRACTION * (n - afterStep)) {
            warnings.add(new FitWarning(FitWarning.Code.SATURATION_PLATEAU, plateau + " samples sit exactly at"
                    + " the output's extreme value: a sensor or actuator limit clipped the response, which a"
                    + " linear model cannot follow; repeat the test with a smaller step"));
        }
        if (sigma > NOISE_DOMINATES_FRACTION * stepChange) {
            warnings.add(new FitWarning(FitWarning.Code.NOISE_DOMINATES, String.format("the residual standard"
                    + " deviation %.3g is %.0f%% of the step change: noise dominates, repeat with a larger step or"
                    + " filter the measurement", sigma, 100 * sigma / stepChange)));
        } else if (stepChange < 10 * sigma) {
            warnings.add(new FitWarning(FitWarning.Code.WEAK_EXCITATION, "the step change is less than ten"
                    + " residual standard deviations: the excitation is weak"));
        }
        if (theta > 0) {
            warnings.add(new FitWarning(FitWarning.Code.DEAD_TIME_NOT_IN_DESIGN, String.format("the fitted dead"
                    + " time %.3g s is not part of the returned plant: a design from it ignores the delay, so keep"
                    + " the closed-loop natural frequency well below 1/(dead time)", theta)));
        }
        return warnings;
    }

    /** Normalized time wn t at which the unit step first reaches 90% (bisection on the monotone rise). */
    private static double riseTo90(double zeta) {
        double hi = 1;
        int doublings = 0;
        while (UnitStepShape.step(hi, zeta) < 0.9 && doublings++ < MAX_BRACKET_DOUBLINGS) {
            hi *= 2;
        }
        double lo = 0;
        for (int i = 0; i < BISECTION_STEPS; i++) {
            double mid = 0.5 * (lo + hi);
            if (UnitStepShape.step(mid, zeta) < 0.9) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return hi;
    }

    /** Starting points: K, zeta, wn read off the record, and a few dead-time guesses. */
    private static List<double[]> starts(double[] t, double[] y, int afterStep, double stepTime, double y0,
                                         double change, double amplitude, FitOptions options) {
        int n = t.length;
        double peak = 0;
        int peakIndex = afterStep;
        for (int i = afterStep; i < n; i++) {
            double normalized = (y[i] - y0) / change;
            if (normalized > peak) {
                peak = normalized;
                peakIndex = i;
            }
        }
        double t10 = crossing(t, y, afterStep, y0, change, 0.1) - stepTime;
        double t50 = crossing(t, y, afterStep, y0, change, 0.5) - stepTime;
        double overshoot = peak - 1;
        double[] thetaFractions = options.estimateDeadTime() ? new double[] {0, 0.3, 0.6, 0.9} : new double[] {0};
        List<double[]> starts = new ArrayList<>();
        for (double fraction : Arrays.copyOf(thetaFractions, Math.min(thetaFractions.length, MAX_STARTS))) {
            double theta = fraction * Math.max(t10, 0);
            double zeta;
            double wn;
            if (overshoot > 0.02 && overshoot < 1) {
                zeta = OvershootDamping.dampingRatio(overshoot);
                double tp = Math.max(t[peakIndex] - stepTime - theta, 1e-12);
                wn = Math.PI / (tp * Math.sqrt(1 - zeta * zeta));
            } else {
                zeta = 1;
                // The critically damped unit step reaches 50% at wn t = 1.678 (solve 1 - (1 + x) e^-x = 1/2).
                wn = 1.678 / Math.max(t50 - theta, 1e-12);
            }
            double[] start = new double[3 + (options.estimateDeadTime() ? 1 : 0)
                    + (options.estimateInitialOffset() ? 1 : 0)];
            start[0] = change / amplitude;
            start[1] = wn;
            start[2] = zeta;
            if (options.estimateDeadTime()) {
                start[3] = theta;
            }
            if (options.estimateInitialOffset()) {
                start[start.length - 1] = y0;
            }
            starts.add(start);
        }
        return starts;
    }

    /** First time the normalized response reaches the level (linear interpolation); the last time if never. */
    private static double crossing(double[] t, double[] y, int from, double y0, double change, double level) {
        for (int i = Math.max(from, 1); i < t.length; i++) {
            double previous = (y[i - 1] - y0) / change;
            double current = (y[i] - y0) / change;
            if (current >= level && i > from) {
                return previous >= level ? t[i] : t[i - 1] + (t[i] - t[i - 1]) * (level - previous)
                        / (current - previous);
            }
        }
        return t[t.length - 1];
    }

    private static int firstIndexAtOrAfter(double[] t, double time) {
        for (int i = 0; i < t.length; i++) {
            if (t[i] >= time) {
                return i;
            }
        }
        return t.length;
    }

    private static double mean(double[] v, int from, int to) {
        double sum = 0;
        for (int i = from; i < to; i++) {
            sum += v[i];
        }
        return sum / (to - from);
    }

    private static double max(double[] v, int from, int to) {
        double m = Double.NEGATIVE_INFINITY;
        for (int i = from; i < to; i++) {
            m = Math.max(m, v[i]);
        }
        return m;
    }

    private static double min(double[] v, int from, int to) {
        double m = Double.POSITIVE_INFINITY;
        for (int i = from; i < to; i++) {
            m = Math.min(m, v[i]);
        }
        return m;
    }

    /**
     * The model and its Jacobian: dy/dK = A S, dy/dwn = K A (t - t0) S'(tau), dy/dtheta = -K A wn S'(tau),
     * dy/dy0 = 1 (tau = wn (t - t0), t0 = t_step + theta); dy/dzeta by central differences.
     */
    private static final class ResponseModel
            implements org.hipparchus.optim.nonlinear.vector.leastsquares.MultivariateJacobianFunction {

        private static final double ZETA_STEP = 1e-6;

        private final double[] t;
        private final double stepTime;
        private final double amplitude;
        private final FitOptions options;
        private final double durationSeconds;
        private final double minNaturalFrequency;

        ResponseModel(StepTestData data, FitOptions options) {
            this.t = data.timeSeconds();
            this.stepTime = data.stepTimeSeconds();
            this.amplitude = data.stepAmplitude();
            this.options = options;
            this.durationSeconds = t[t.length - 1] - stepTime;
            // Slower than one radian over a thousand records is not identifiable from this record.
            this.minNaturalFrequency = 1e-3 / Math.max(durationSeconds, 1e-12);
        }

        String[] names() {
            List<String> names = new ArrayList<>(List.of("gain", "naturalFrequency", "dampingRatio"));
            if (options.estimateDeadTime()) {
                names.add("deadTime");
            }
            if (options.estimateInitialOffset()) {
                names.add("initialOffset");
            }
            return names.toArray(String[]::new);
        }

        RealVector clamp(RealVector point) {
            double[] x = point.toArray();
            x[1] = Math.max(x[1], minNaturalFrequency);
            x[2] = Math.min(Math.max(x[2], 1e-4), MAX_DAMPING_RATIO);
            if (options.estimateDeadTime()) {
                x[3] = Math.min(Math.max(x[3], 0), durationSeconds);
            }
            return new ArrayRealVector(x, false);
        }

        @Override
        public Pair<RealVector, RealMatrix> value(RealVector point) {
            com.loopwright.solver.cancel.Cancellation.checkpoint(); // one model evaluation of the least-squares fit
            double[] x = point.toArray();
            int p = x.length;
            double gain = x[0];
            double wn = x[1];
            double zeta = x[2];
            double theta = options.estimateDeadTime() ? x[3] : 0;
            double y0 = options.estimateInitialOffset() ? x[p - 1] : 0;
            double h = ZETA_STEP * Math.max(zeta, 1e-2);
            double[] values = new double[t.length];
            double[][] jacobian = new double[t.length][p];
            for (int i = 0; i < t.length; i++) {
                double elapsed = t[i] - stepTime - theta;
                double tau = wn * elapsed;
                double s = UnitStepShape.step(tau, zeta);
                double ds = UnitStepShape.impulse(tau, zeta);
                values[i] = y0 + gain * amplitude * s;
                jacobian[i][0] = amplitude * s;
                jacobian[i][1] = gain * amplitude * Math.max(elapsed, 0) * ds;
                jacobian[i][2] = gain * amplitude * (UnitStepShape.step(tau, zeta + h)
                        - UnitStepShape.step(tau, zeta - h)) / (2 * h);
                if (options.estimateDeadTime()) {
                    jacobian[i][3] = -gain * amplitude * wn * ds;
                }
                if (options.estimateInitialOffset()) {
                    jacobian[i][p - 1] = 1;
                }
            }
            return new Pair<>(new ArrayRealVector(values, false), new Array2DRowRealMatrix(jacobian, false));
        }
    }
}
