package com.loopwright.solver.robustness;

import com.loopwright.solver.frequency.LoopMargins;
import com.loopwright.solver.frequency.LoopFrequencyAnalyzer;
import com.loopwright.solver.loop.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import com.loopwright.solver.simulation.DenseTrajectory;
import com.loopwright.solver.simulation.DisturbanceProfile;
import com.loopwright.solver.simulation.DisturbanceResponse;
import com.loopwright.solver.simulation.DisturbanceSimulator;
import com.loopwright.solver.simulation.GridMetrics;
import com.loopwright.solver.simulation.SaturatedStepSimulator;
import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.numeric.SafeRounding;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.StepMetrics;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.simulation.StepSimulator;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * Verifies a loop (plant and gains) beyond the nominal model: parameter uncertainty, disturbances, an actuator
 * limit, sampling, input delay and frequency-domain margins. Stateless and thread-safe.
 *
 * <p>Horizons: the nominal loop is simulated over H = {@value LoopMatrices#HORIZON_PER_TIME_CONSTANT} slowest
 * closed-loop time constants, or past the overshoot peak when that comes later (see LoopMatrices.horizonSeconds); saturated, sampled and delayed loops, which are slower, over
 * {@value #SLOW_HORIZON_FACTOR} H.
 */
public final class RobustnessVerifier {

    static final double SLOW_HORIZON_FACTOR = 3;
    /** Sample intervals over the slow horizon when a delay is simulated without a requested Ts. */
    static final int DELAY_SIMULATION_INTERVALS = 20_000;
    /** Disturbance start plus duration at most this many nominal horizons. */
    public static final double MAX_DISTURBANCE_TIMING_HORIZONS = 10;
    /** Delay at most this many nominal horizons. */
    public static final double MAX_DELAY_HORIZONS = 1;
    /** Search caps for the longest sample period. */
    static final int MAX_DOUBLINGS = 6;
    static final int MAX_HALVINGS = 12;
    static final int MAX_BISECTIONS = 20;
    static final double SEARCH_RELATIVE_WIDTH = 1e-3;
    /** Relative slack on observedGain &lt;= hinfNorm for the norm's stated accuracy. */
    static final double NORM_SLACK = 1e-8;
    /** Significant digits of advised limits in messages (rounded toward the accepted side). */
    static final int ADVICE_DIGITS = 6;
    /** Cap on last-digit raises of an advised shortest sample period. */
    static final int MAX_ADVICE_STEPS = 10;

    private final StepResponseMetrics stepMetrics = new StepResponseMetrics();
    private final HInfinityNormCalculator norms = new HInfinityNormCalculator();
    private final UncertaintyAnalyzer uncertainty = new UncertaintyAnalyzer();
    private final LoopFrequencyAnalyzer frequency = new LoopFrequencyAnalyzer();
    private final SaturatedStepSimulator saturated = new SaturatedStepSimulator();
    private final DelayedSampledStepSimulator sampled = new DelayedSampledStepSimulator();
    private final DisturbanceSimulator disturbance = new DisturbanceSimulator();
    private final DiscretePoleMatching discrete = new DiscretePoleMatching();

    /**
     * @param performanceOutput C_z of z = C_z x for the disturbance gain (p x 2)
     * @param gamma             the design's certified bound on the w-to-z gain, or null
     * @throws UnstableLoopException when the nominal loop is unstable
     * @throws CapExceededException when a check would exceed a computation cap
     */
    public RobustnessReport verify(CanonicalPlant plant, FeedbackGains gains, double stepSize, AcceptanceLimits limits,
                                   DMatrixRMaj performanceOutput, Double gamma, RobustnessOptions options) {
        if (!LoopMatrices.stable(plant, gains)) {
            throw new UnstableLoopException(String.format("the loop is unstable with these gains: closed-loop"
                    + " stiffness a0 + b k1 = %.6g and damping a1 + b k2 = %.6g must both be positive",
                    LoopMatrices.closedLoopStiffness(plant, gains), LoopMatrices.closedLoopDamping(plant, gains)));
        }
        double horizon = LoopMatrices.horizonSeconds(plant, gains);
        double needed = Math.ceil(horizon * LoopMatrices.fastestOscillation(plant, gains)
                / StepResponseMetrics.MAX_RADIANS_PER_SAMPLE) + 2;
        if (needed > StepSimulator.MAX_SAMPLES) {
            throw new UnstableLoopException("the loop is too lightly damped to simulate: it needs " + (long) needed
                    + " samples, more than " + StepSimulator.MAX_SAMPLES);
        }
        StepMetrics nominal = stepMetrics.measure(LoopMatrices.stepLoop(plant, gains), stepSize, horizon,
                (int) Math.max(UncertaintyAnalyzer.BASE_GRID, needed), limits.bandFraction());
        Boolean nominalMeets = judged(limits, nominal.settlingTimeSeconds(), nominal.riseTimeSeconds(),
                nominal.overshootPercent());
        double hinf = plant.d() == 0 ? 0 : norms.compute(LoopMatrices.closedLoop(plant, gains),
                LoopMatrices.disturbanceInput(plant), performanceOutput).value();
        LoopMargins margins = frequency.margins(plant, gains, options.frequencyPoints());

        UncertaintyReport uncertain = options.parameterBox() == null ? null
                : uncertainty.analyze(options.parameterBox(), gains, stepSize, limits, performanceOutput,
                        options.monteCarloSamples(), options.seed());

        List<DisturbanceCheck> checks = new ArrayList<>();
        for (int i = 0; i < options.disturbances().size(); i++) {
            Cancellation.checkpoint();
            DisturbanceProfile profile = options.disturbances().get(i);
            double from = profile.settledFromSeconds();
            if (from > MAX_DISTURBANCE_TIMING_HORIZONS * horizon) {
                throw new CapExceededException(CapExceededException.Option.DISTURBANCE_TIMING, i, String.format(
                        "the disturbance must be over by %.6g s (%s nominal horizons of %.6g s), it ends at %.6g s",
                        SafeRounding.atMost(MAX_DISTURBANCE_TIMING_HORIZONS * horizon, ADVICE_DIGITS),
                        fmt(MAX_DISTURBANCE_TIMING_HORIZONS), horizon, from));
            }
            DisturbanceResponse response = disturbance.simulate(plant, gains, profile, performanceOutput,
                    from >= 0 ? from + horizon : horizon);
            checks.add(new DisturbanceCheck(profile, response,
                    response.observedGain() <= hinf * (1 + NORM_SLACK),
                    gamma == null ? null : response.observedGain() <= gamma));
        }

        double slowHorizon = SLOW_HORIZON_FACTOR * horizon;
        if (options.inputDelaySeconds() != null) {
            double delay = options.inputDelaySeconds();
            if (delay > MAX_DELAY_HORIZONS * horizon) {
                throw new CapExceededException(CapExceededException.Option.INPUT_DELAY, -1, String.format(
                        "the input delay must be at most %.6g s (%s nominal horizon), got %.6g s",
                        SafeRounding.atMost(MAX_DELAY_HORIZONS * horizon, ADVICE_DIGITS), fmt(MAX_DELAY_HORIZONS),
                        delay));
            }
        }
        SaturationReport saturation = null;
        if (options.actuatorLimit() != null) {
            double limit = options.actuatorLimit();
            DenseTrajectory trajectory = null;
            GridMetrics metrics = null;
            try {
                trajectory = saturated.simulate(plant, gains, stepSize, limit, slowHorizon);
                metrics = GridMetrics.of(trajectory, LoopMatrices.unitStepFinalValue(plant, gains) * stepSize,
                        limits.bandFraction());
            } catch (IllegalArgumentException e) {
                trajectory = null; // the state overflowed: the limited actuator cannot hold this loop
            }
            double peak = nominal.peakControl();
            saturation = new SaturationReport(limit, peak, peak > limit,
                    peak == 0 ? null : limit * Math.abs(stepSize) / peak, metrics == null, metrics,
                    metrics == null ? (limits.judges() ? false : null)
                            : judged(limits, metrics.settlingTimeSeconds(), metrics.riseTimeSeconds(),
                                    metrics.overshootPercent()), trajectory);
        }

        SampledReport sampledReport = null;
        if (options.samplePeriodSeconds() != null) {
            double ts = options.samplePeriodSeconds();
            // the delayed step runs at the same Ts over a horizon longer by the delay: advise for the longer one
            double delayed = options.inputDelaySeconds() == null ? 0 : options.inputDelaySeconds();
            requireIntervals(ts, slowHorizon + delayed, CapExceededException.Option.SAMPLE_PERIOD);
            double radius = spectralRadius(plant, gains, ts);
            DenseTrajectory emulated = null;
            GridMetrics emulatedMetrics = null;
            try {
                emulated = sampled.simulate(plant, gains, stepSize, ts, 0, slowHorizon);
                emulatedMetrics = metricsOf(emulated, plant, gains, stepSize, limits);
            } catch (IllegalArgumentException e) {
                emulated = null; // overflow: the sampled loop diverges (see the spectral radius)
            }
            FeedbackGains directGains = null;
            GridMetrics directMetrics = null;
            try {
                directGains = discrete.design(plant, gains, ts);
                directMetrics = metricsOf(sampled.simulate(plant, directGains, stepSize, ts, 0, slowHorizon),
                        plant, directGains, stepSize, limits);
            } catch (IllegalArgumentException e) {
                directMetrics = null; // the direct design overflowed: it cannot be used at this Ts
            }
            double[] search = options.searchLongestPeriod() && limits.judges()
                    ? longestPeriod(plant, gains, stepSize, limits, slowHorizon) : new double[] {Double.NaN, 0, 0};
            sampledReport = new SampledReport(ts, radius, emulatedMetrics,
                    emulatedMetrics == null ? (limits.judges() ? false : null)
                            : judged(limits, emulatedMetrics.settlingTimeSeconds(), emulatedMetrics.riseTimeSeconds(),
                                    emulatedMetrics.overshootPercent()),
                    directGains, directMetrics, directMetrics == null ? (limits.judges() ? false : null)
                            : judged(limits, directMetrics.settlingTimeSeconds(), directMetrics.riseTimeSeconds(),
                                    directMetrics.overshootPercent()),
                    Double.isNaN(search[0]) ? null : search[0], search[1] == 1, (int) search[2], emulated);
        }

        DelayReport delayReport = null;
        if (options.inputDelaySeconds() != null) {
            double delay = options.inputDelaySeconds();
            double ts = options.samplePeriodSeconds() != null ? options.samplePeriodSeconds()
                    : slowHorizon / DELAY_SIMULATION_INTERVALS;
            double delayHorizon = slowHorizon + delay;
            requireIntervals(ts, delayHorizon, CapExceededException.Option.INPUT_DELAY);
            Double margin = margins.delayMarginSeconds();
            DenseTrajectory trajectory = null;
            GridMetrics metrics = null;
            boolean diverges = false;
            try {
                trajectory = sampled.simulate(plant, gains, stepSize, ts, delay, delayHorizon);
                metrics = metricsOf(trajectory, plant, gains, stepSize, limits);
            } catch (IllegalArgumentException e) {
                diverges = true;
            }
            delayReport = new DelayReport(delay, ts, margin, margin == null ? null : delay < margin, diverges,
                    metrics, metrics == null ? (limits.judges() ? false : null)
                            : judged(limits, metrics.settlingTimeSeconds(), metrics.riseTimeSeconds(),
                                    metrics.overshootPercent()), trajectory);
        }
        DenseTrajectory nominalTrajectory = options.seriesPoints() > 0
                ? saturated.simulate(plant, gains, stepSize, Double.POSITIVE_INFINITY, horizon) : null;
        return new RobustnessReport(nominal, nominalMeets, horizon, hinf, margins, uncertain, checks, saturation,
                sampledReport, delayReport, nominalTrajectory);
    }

    /** max |z| over the eigenvalues of Ad - Bd K, the emulated sampled loop without delay. */
    private static double spectralRadius(CanonicalPlant plant, FeedbackGains gains, double ts) {
        try {
            com.loopwright.solver.simulation.DiscreteStateSpace hold = com.loopwright.solver.simulation.ZeroOrderHold
                    .discretize(LoopMatrices.openLoop(plant), LoopMatrices.actuatorInput(plant), ts);
            DMatrixRMaj closed = hold.ad();
            DMatrixRMaj bd = hold.bd();
            for (int i = 0; i < 2; i++) {
                closed.add(i, 0, -bd.get(i, 0) * gains.positionGain());
                closed.add(i, 1, -bd.get(i, 0) * gains.velocityGain());
            }
            double radius = 0;
            for (org.ejml.data.Complex_F64 z : LoopMatrices.poles(closed)) {
                radius = Math.max(radius, z.getMagnitude());
            }
            return radius;
        } catch (IllegalArgumentException e) {
            return Double.MAX_VALUE; // e^(A Ts) overflows: the open loop grows beyond double precision in one period
        }
    }

    private static void requireIntervals(double ts, double horizon, CapExceededException.Option option) {
        if (!fitsIntervals(ts, horizon)) {
            throw new CapExceededException(option, -1, String.format("the sampled simulation over %.6g s at"
                    + " Ts = %.6g s needs %.0f sample intervals, more than the cap %d: use Ts >= %.6g s", horizon, ts,
                    Math.ceil(horizon / ts), DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS,
                    shortestPeriod(horizon)));
        }
    }

    private static boolean fitsIntervals(double ts, double horizon) {
        return Math.ceil(horizon / ts) <= DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS;
    }

    /**
     * The advised shortest Ts for a horizon: horizon / cap rounded up at the printed precision, then raised by
     * one unit of the last printed digit while the interval count (a rounded division) still exceeds the cap.
     */
    static double shortestPeriod(double horizon) {
        double advice = SafeRounding.atLeast(horizon / DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS, ADVICE_DIGITS);
        for (int i = 0; i < MAX_ADVICE_STEPS && !fitsIntervals(advice, horizon); i++) {
            double unit = Math.pow(10, Math.floor(Math.log10(advice)) - (ADVICE_DIGITS - 1));
            advice = SafeRounding.atLeast(advice + unit, ADVICE_DIGITS);
        }
        return advice;
    }

    private static GridMetrics metricsOf(DenseTrajectory trajectory, CanonicalPlant plant, FeedbackGains gains,
                                         double stepSize, AcceptanceLimits limits) {
        // the sampled loop's DC gain equals the continuous one: at rest x2 = 0 and u = kr r - k1 x1 = a0 x1 / b
        return GridMetrics.of(trajectory, LoopMatrices.unitStepFinalValue(plant, gains) * stepSize,
                limits.bandFraction());
    }

    private static Boolean judged(AcceptanceLimits limits, Double settling, Double rise, double overshoot) {
        return limits.judges() ? limits.met(settling, rise, overshoot) : null;
    }

    /**
     * {longest Ts, 1 if it is only a lower bound, evaluations}: doubling or halving from pi / max|lambda| to a
     * bracket [meeting, failing], then bisection to {@value #SEARCH_RELATIVE_WIDTH} relative width. Assumes the
     * limits hold for all Ts below the first failing one that the bracket finds.
     */
    private double[] longestPeriod(CanonicalPlant plant, FeedbackGains gains, double stepSize, AcceptanceLimits limits,
                                   double horizon) {
        int[] evaluations = {0};
        double start = Math.PI / LoopMatrices.fastestPoleMagnitude(plant, gains);
        double lo;
        double hi;
        if (meets(plant, gains, stepSize, limits, horizon, start, evaluations)) {
            lo = start;
            hi = Double.NaN;
            for (int i = 0; i < MAX_DOUBLINGS; i++) {
                double next = 2 * lo;
                if (meets(plant, gains, stepSize, limits, horizon, next, evaluations)) {
                    lo = next;
                } else {
                    hi = next;
                    break;
                }
            }
            if (Double.isNaN(hi)) {
                return new double[] {lo, 1, evaluations[0]};
            }
        } else {
            hi = start;
            lo = Double.NaN;
            for (int i = 0; i < MAX_HALVINGS; i++) {
                double next = hi / 2;
                if (meets(plant, gains, stepSize, limits, horizon, next, evaluations)) {
                    lo = next;
                    break;
                }
                hi = next;
            }
            if (Double.isNaN(lo)) {
                return new double[] {Double.NaN, 0, evaluations[0]};
            }
        }
        for (int i = 0; i < MAX_BISECTIONS && hi - lo > SEARCH_RELATIVE_WIDTH * lo; i++) {
            double mid = 0.5 * (lo + hi);
            if (meets(plant, gains, stepSize, limits, horizon, mid, evaluations)) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return new double[] {lo, 0, evaluations[0]};
    }

    private boolean meets(CanonicalPlant plant, FeedbackGains gains, double stepSize, AcceptanceLimits limits,
                          double horizon, double ts, int[] evaluations) {
        Cancellation.checkpoint(); // one simulation of the longest-period search
        evaluations[0]++;
        if (Math.ceil(horizon / ts) > DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS) {
            return false;
        }
        try {
            GridMetrics metrics = metricsOf(sampled.simulate(plant, gains, stepSize, ts, 0, horizon), plant, gains,
                    stepSize, limits);
            return limits.met(metrics.settlingTimeSeconds(), metrics.riseTimeSeconds(), metrics.overshootPercent());
        } catch (IllegalArgumentException e) {
            return false;
        }
    }

    private static String fmt(double value) {
        return value == Math.rint(value) ? String.valueOf((long) value) : String.valueOf(value);
    }
}
