package com.loopwright.solver.fit;

import com.loopwright.solver.plant.FitOptions;
import com.loopwright.solver.plant.FitWarning;
import com.loopwright.solver.plant.FittedParameter;
import com.loopwright.solver.plant.StepFit;
import com.loopwright.solver.plant.StepTestData;
import com.loopwright.solver.spec.NormalizedSettlingTime;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import org.hipparchus.distribution.continuous.TDistribution;
import org.hipparchus.exception.MathIllegalArgumentException;
import org.hipparchus.exception.MathIllegalStateException;
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
 * with every parameter kept in its box (theta &gt;= 0, see {@link ResponseModel}).
 *
 * <p>Without a dead time, one start read off the data (final value, peak or 50% crossing) is refined. With a
 * dead time, the cost is first profiled over it: at {@link #PROFILE_DEAD_TIMES} held dead times from 0 to
 * 7/8 of the 50% crossing the other parameters are fitted, the {@link #FULL_FIT_STARTS} best profile points
 * start fits of all parameters, and the lowest cost among those and the profile point at theta = 0 (the
 * optimum on the bound, where the data want a negative dead time) wins. A single start at theta = 0 can stall
 * there in a local minimum far from the optimum; the profile sees the whole range of plausible dead times.
 *
 * <p>Standard errors come from s^2 (J'J)^-1 at the optimum with s^2 = SSR/(n - p) ({@link ParameterCovariance});
 * 95% intervals use Student's t with n - p degrees of freedom and are clipped to the values a parameter can take.
 * A parameter on a bound of its box is reported with an {@code AT_BOUND} warning, a parameter the data do not
 * determine without an interval and with a {@code POORLY_DETERMINED} warning. Stateless and thread-safe.
 */
public final class StepResponseFitter {

    /** Fewest samples accepted (each parameter needs several). */
    public static final int MIN_SAMPLES = 8;
    /** Levenberg-Marquardt iterations of a fit of all parameters. */
    public static final int MAX_ITERATIONS = 200;
    /** Model evaluations of a fit of all parameters. */
    public static final int MAX_EVALUATIONS = 1000;
    /** Held dead times of the profile (each one fit of the other parameters). */
    public static final int PROFILE_DEAD_TIMES = 8;
    /** Levenberg-Marquardt iterations of one profile point. */
    public static final int PROFILE_ITERATIONS = 50;
    /** Model evaluations of one profile point. */
    public static final int PROFILE_EVALUATIONS = 200;
    /** Best profile points that start a fit of all parameters. */
    public static final int FULL_FIT_STARTS = 2;
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
    /** Largest held dead time of the profile, as a fraction of the time to the 50% crossing. */
    static final double PROFILE_SPAN_OF_HALF_RISE = (PROFILE_DEAD_TIMES - 1.0) / PROFILE_DEAD_TIMES;

    /** Doublings allowed when bracketing the 90% point (wn t beyond 2^60 is never reached for zeta &lt;= 50). */
    private static final int MAX_BRACKET_DOUBLINGS = 60;
    /** Bisection steps on the 90% point (enough to reach double precision from any bracket). */
    private static final int BISECTION_STEPS = 100;

    private final int maxIterations;

    public StepResponseFitter() {
        this(MAX_ITERATIONS);
    }

    /** A fitter with a lower iteration cap per run (tests of the non-convergence path). */
    StepResponseFitter(int maxIterations) {
        if (maxIterations < 1 || maxIterations > MAX_ITERATIONS) {
            throw new IllegalArgumentException("iteration cap must be from 1 to " + MAX_ITERATIONS);
        }
        this.maxIterations = maxIterations;
    }

    /** One Levenberg-Marquardt run: the point in the layout of the full fit, its cost sqrt(SSR), its work. */
    private record Run(double[] point, double cost, int iterations, int evaluations) {}

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
            throw new FitFailedException(
                    "the output does not move after the step: there is no excitation to" + " identify a model from");
        }
        ResponseModel model = new ResponseModel(data, options);
        StartingGuess guess =
                new StartingGuess(t, y, afterStep, data.stepTimeSeconds(), y0Guess, change, data.stepAmplitude());
        List<Run> finalists = search(model, guess, y, options);
        Run best = finalists.stream()
                .filter(r -> Double.isFinite(r.cost()))
                .min(Comparator.comparingDouble(Run::cost))
                .orElseThrow(() -> new FitFailedException("the least-squares fit did not converge within "
                        + maxIterations + " iterations and " + MAX_EVALUATIONS
                        + " evaluations; the record may not be a second-order step response"));
        return summarize(data, model, best, n, p, afterStep);
    }

    /**
     * Every Levenberg-Marquardt run of one fit, in order: the dead-time profile (when the dead time is
     * estimated), then the fits of all parameters from the best profile points or from the guess. Returns the
     * converged runs that may be the answer: the full fits and the profile point on the bound theta = 0.
     */
    private List<Run> search(ResponseModel model, StartingGuess guess, double[] y, FitOptions options) {
        List<Run> finalists = new ArrayList<>();
        List<double[]> starts = new ArrayList<>();
        if (options.estimateDeadTime()) {
            // The profile: the other parameters fitted at each held dead time; failed points rank by their start.
            List<Run> profile = new ArrayList<>();
            double span = PROFILE_SPAN_OF_HALF_RISE * Math.max(guess.halfRiseSeconds(), 0);
            int points = span > 0 ? PROFILE_DEAD_TIMES : 1;
            for (int k = 0; k < points; k++) {
                double heldDeadTime = points == 1 ? 0 : span * k / (points - 1);
                ResponseModel held = model.holdingDeadTime(heldDeadTime);
                double[] start = guess.point(heldDeadTime, false, options.estimateInitialOffset());
                Optional<Run> run =
                        minimize(held, y, start, Math.min(maxIterations, PROFILE_ITERATIONS), PROFILE_EVALUATIONS);
                run.filter(r -> heldDeadTime == 0).ifPresent(finalists::add);
                profile.add(run.orElse(new Run(held.fullLayout(start), cost(held, y, start), 0, 1)));
            }
            profile.sort(Comparator.comparingDouble(Run::cost));
            for (int k = 0; k < Math.min(FULL_FIT_STARTS, profile.size()); k++) {
                starts.add(profile.get(k).point());
            }
        } else {
            starts.add(guess.point(0, false, options.estimateInitialOffset()));
        }
        for (double[] start : starts) {
            minimize(model, y, start, maxIterations, MAX_EVALUATIONS).ifPresent(finalists::add);
        }
        return finalists;
    }

    /**
     * One Levenberg-Marquardt run of the model from the start, kept in the model's box; empty when it does not
     * converge within the caps. Every run of a fit goes through here.
     */
    private static Optional<Run> minimize(
            ResponseModel model, double[] y, double[] start, int iterations, int evaluations) {
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start)
                .model(model)
                .target(y)
                .parameterValidator(model::clamp)
                .maxIterations(iterations)
                .maxEvaluations(evaluations)
                .lazyEvaluation(false)
                .build();
        try {
            LeastSquaresOptimizer.Optimum optimum = new LevenbergMarquardtOptimizer().optimize(problem);
            double[] point = optimum.getPoint().toArray();
            return Optional.of(new Run(
                    model.fullLayout(point), optimum.getCost(), optimum.getIterations(), optimum.getEvaluations()));
        } catch (MathIllegalStateException | MathIllegalArgumentException e) {
            return Optional.empty();
        }
    }

    /** sqrt(SSR) of the model at the point, the cost Levenberg-Marquardt reports. */
    private static double cost(ResponseModel model, double[] y, double[] point) {
        double[] fitted =
                model.value(new ArrayRealVector(point, false)).getFirst().toArray();
        double ssr = 0;
        for (int i = 0; i < y.length; i++) {
            ssr += (y[i] - fitted[i]) * (y[i] - fitted[i]);
        }
        return Math.sqrt(ssr);
    }

    private StepFit summarize(StepTestData data, ResponseModel model, Run best, int n, int p, int afterStep) {
        double[] point = best.point();
        double[] y = data.output();
        Pair<RealVector, RealMatrix> atOptimum = model.value(new ArrayRealVector(point, false));
        double[] fitted = atOptimum.getFirst().toArray();
        double ssr = 0;
        for (int i = 0; i < n; i++) {
            ssr += (y[i] - fitted[i]) * (y[i] - fitted[i]);
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
        double theta = model.deadTime(point);
        double y0 = model.initialOffset(point);
        double stepChange = Math.abs(gain * data.stepAmplitude());
        double sigma = Math.sqrt(s2);
        if (!(stepChange > MIN_SIGNAL_TO_NOISE * sigma)) {
            throw new FitFailedException(String.format(
                    "the fitted step change %.3g is below %.0f residual"
                            + " standard deviations (%.3g): the noise hides the response, so no model is identified",
                    stepChange, MIN_SIGNAL_TO_NOISE, sigma));
        }
        double[] standardErrors = ParameterCovariance.standardErrors(atOptimum.getSecond(), s2);
        double quantile = new TDistribution(dof).inverseCumulativeProbability(0.975);
        String[] names = model.names();
        double[] lowest = model.physicalLowerBounds();
        double[] highest = model.upperBounds();
        boolean[] atBound = model.atBound(point);
        List<FittedParameter> parameters = new ArrayList<>();
        List<FitWarning> warnings = new ArrayList<>();
        for (int i = 0; i < p; i++) {
            double se = standardErrors[i];
            if (atBound[i]) {
                warnings.add(new FitWarning(
                        FitWarning.Code.AT_BOUND,
                        String.format(
                                "%s = %.4g sits on the bound"
                                        + " of the values the fit may take: the optimum is constrained there, its interval is"
                                        + " one-sided (clipped at the bound) and only approximate",
                                names[i], point[i])));
            }
            if (!Double.isFinite(se)) {
                parameters.add(new FittedParameter(names[i], point[i], Double.NaN, Double.NaN, Double.NaN));
                warnings.add(new FitWarning(
                        FitWarning.Code.POORLY_DETERMINED,
                        String.format(
                                "%s = %.4g is not"
                                        + " determined by the data (J'J is singular in its direction), so it has no standard"
                                        + " error or interval: record more of the transient or excite the plant harder",
                                names[i], point[i])));
                continue;
            }
            parameters.add(new FittedParameter(
                    names[i],
                    point[i],
                    se,
                    Math.max(point[i] - quantile * se, lowest[i]),
                    Math.min(point[i] + quantile * se, highest[i])));
            if (i < 3 && se > POORLY_DETERMINED_RELATIVE_ERROR * Math.abs(point[i])) {
                warnings.add(new FitWarning(
                        FitWarning.Code.POORLY_DETERMINED,
                        String.format(
                                "%s = %.4g has a"
                                        + " standard error of %.0f%% of its value: the data hardly determine it",
                                names[i], point[i], 100 * se / Math.abs(point[i]))));
            }
        }
        warnings.addAll(dataWarnings(data, afterStep, wn, zeta, theta, stepChange, sigma));
        return new StepFit(
                gain,
                wn,
                zeta,
                theta,
                y0,
                parameters,
                Math.sqrt(ssr / n),
                sst == 0 ? 0 : 1 - ssr / sst,
                dof,
                best.iterations(),
                best.evaluations(),
                warnings);
    }

    private static List<FitWarning> dataWarnings(
            StepTestData data, int afterStep, double wn, double zeta, double theta, double stepChange, double sigma) {
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
            warnings.add(new FitWarning(
                    FitWarning.Code.RECORD_TOO_SHORT,
                    String.format(
                            "the record ends %.3g s"
                                    + " after the response starts, before the fitted model settles to 2%% (%.3g s): the final"
                                    + " value and the gain are extrapolated",
                            recorded, settling)));
        }
        double riseEnd = data.stepTimeSeconds() + theta + riseTo90(zeta) / wn;
        int inTransient = 0;
        for (int i = afterStep; i < n && t[i] <= riseEnd; i++) {
            inTransient++;
        }
        if (inTransient < MIN_TRANSIENT_SAMPLES) {
            warnings.add(new FitWarning(
                    FitWarning.Code.FEW_SAMPLES_IN_TRANSIENT,
                    "only " + inTransient
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
            warnings.add(new FitWarning(
                    FitWarning.Code.SATURATION_PLATEAU,
                    plateau + " samples sit exactly at"
                            + " the output's extreme value: a sensor or actuator limit clipped the response, which a"
                            + " linear model cannot follow; repeat the test with a smaller step"));
        }
        if (sigma > NOISE_DOMINATES_FRACTION * stepChange) {
            warnings.add(new FitWarning(
                    FitWarning.Code.NOISE_DOMINATES,
                    String.format(
                            "the residual standard"
                                    + " deviation %.3g is %.0f%% of the step change: noise dominates, repeat with a larger step or"
                                    + " filter the measurement",
                            sigma, 100 * sigma / stepChange)));
        } else if (stepChange < 10 * sigma) {
            warnings.add(new FitWarning(
                    FitWarning.Code.WEAK_EXCITATION,
                    "the step change is less than ten" + " residual standard deviations: the excitation is weak"));
        }
        if (theta > 0) {
            warnings.add(new FitWarning(
                    FitWarning.Code.DEAD_TIME_NOT_IN_DESIGN,
                    String.format(
                            "the fitted dead"
                                    + " time %.3g s is not part of the returned plant: a design from it ignores the delay, so keep"
                                    + " the closed-loop natural frequency well below 1/(dead time)",
                            theta)));
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
}
