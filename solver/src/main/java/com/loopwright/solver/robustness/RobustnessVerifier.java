package com.loopwright.solver.robustness;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.GridMetrics;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.frequency.LoopFrequencyAnalyzer;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.numeric.SafeRounding;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.SaturatedStepSimulator;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.simulation.StepSimulator;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * Verifies a loop (plant and gains) beyond the nominal model: parameter uncertainty, disturbances, an actuator
 * limit, sampling, input delay and frequency-domain margins, one small class per check ({@link DisturbanceRejection},
 * {@link SaturationCheck}, {@link SampledCheck}, {@link DelayCheck}, {@link UncertaintyAnalyzer}), each judged as a
 * {@link Verdict}. Stateless and thread-safe.
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
    private final DisturbanceRejection disturbances = new DisturbanceRejection();
    private final SaturationCheck saturation = new SaturationCheck(saturated);
    private final SampledCheck sampledCheck = new SampledCheck(sampled);
    private final DelayCheck delayCheck = new DelayCheck(sampled);

    /**
     * @param performanceOutput C_z of z = C_z x for the disturbance gain (p x 2)
     * @param gamma             the design's certified bound on the w-to-z gain, or null
     * @throws UnstableLoopException when the nominal loop is unstable
     * @throws CapExceededException when a check would exceed a computation cap
     */
    public RobustnessReport verify(
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            AcceptanceLimits limits,
            DMatrixRMaj performanceOutput,
            Double gamma,
            RobustnessOptions options) {
        requireStable(plant, gains);
        double horizon = LoopMatrices.horizonSeconds(plant, gains);
        StepMetrics nominal = nominalStep(plant, gains, stepSize, limits, horizon);
        Verdict nominalMeets = Verdict.ofStep(
                limits, nominal.settlingTimeSeconds(), nominal.riseTimeSeconds(), nominal.overshootPercent());
        double hinf = plant.d() == 0
                ? 0
                : norms.compute(
                                LoopMatrices.closedLoop(plant, gains),
                                LoopMatrices.disturbanceInput(plant),
                                performanceOutput)
                        .value();
        LoopMargins margins = frequency.margins(plant, gains, options.frequencyPoints());
        UncertaintyReport uncertain = options.parameterBox() == null
                ? null
                : uncertainty.analyze(
                        options.parameterBox(),
                        gains,
                        stepSize,
                        limits,
                        performanceOutput,
                        options.monteCarloSamples(),
                        options.seed());
        List<DisturbanceCheck> checks =
                disturbances.run(plant, gains, options.disturbances(), performanceOutput, hinf, gamma, horizon);
        double slowHorizon = SLOW_HORIZON_FACTOR * horizon;
        if (options.inputDelaySeconds() != null) {
            requireDelayWithinCap(options.inputDelaySeconds(), horizon);
        }
        SaturationReport saturationReport = options.actuatorLimit() == null
                ? null
                : saturation.run(
                        plant, gains, stepSize, options.actuatorLimit(), limits, nominal.peakControl(), slowHorizon);
        SampledReport sampledReport = null;
        if (options.samplePeriod() != null) {
            double ts = options.samplePeriod();
            // the delayed step runs at the same Ts over a horizon longer by the delay: advise for the longer one
            double delayed = options.inputDelaySeconds() == null ? 0 : options.inputDelaySeconds();
            requireIntervals(ts, slowHorizon + delayed, CapExceededException.Option.SAMPLE_PERIOD);
            sampledReport =
                    sampledCheck.run(plant, gains, stepSize, ts, limits, options.searchLongestPeriod(), slowHorizon);
        }
        DelayReport delayReport = null;
        if (options.inputDelaySeconds() != null) {
            double delay = options.inputDelaySeconds();
            double ts =
                    options.samplePeriod() != null ? options.samplePeriod() : slowHorizon / DELAY_SIMULATION_INTERVALS;
            double delayHorizon = slowHorizon + delay;
            requireIntervals(ts, delayHorizon, CapExceededException.Option.INPUT_DELAY);
            delayReport = delayCheck.run(
                    plant, gains, stepSize, delay, ts, margins.delayMarginSeconds(), limits, delayHorizon);
        }
        DenseTrajectory nominalTrajectory = options.seriesPoints() > 0
                ? saturated.simulate(plant, gains, stepSize, Double.POSITIVE_INFINITY, horizon)
                : null;
        return new RobustnessReport(
                nominal,
                nominalMeets,
                horizon,
                hinf,
                margins,
                uncertain,
                checks,
                saturationReport,
                sampledReport,
                delayReport,
                nominalTrajectory);
    }

    private static void requireStable(CanonicalPlant plant, FeedbackGains gains) {
        if (!LoopMatrices.stable(plant, gains)) {
            throw new UnstableLoopException(String.format(
                    "the loop is unstable with these gains: closed-loop"
                            + " stiffness a0 + b k1 = %.6g and damping a1 + b k2 = %.6g must both be positive",
                    LoopMatrices.closedLoopStiffness(plant, gains), LoopMatrices.closedLoopDamping(plant, gains)));
        }
    }

    /** Exact step metrics of the nominal continuous loop, on enough samples for its fastest oscillation. */
    private StepMetrics nominalStep(
            CanonicalPlant plant, FeedbackGains gains, double stepSize, AcceptanceLimits limits, double horizon) {
        double needed = Math.ceil(horizon
                        * LoopMatrices.fastestOscillation(plant, gains)
                        / StepResponseMetrics.MAX_RADIANS_PER_SAMPLE)
                + 2;
        if (needed > StepSimulator.MAX_SAMPLES) {
            throw new UnstableLoopException("the loop is too lightly damped to simulate: it needs " + (long) needed
                    + " samples, more than " + StepSimulator.MAX_SAMPLES);
        }
        return stepMetrics.measure(
                LinearLoop.ofStep(plant, gains),
                stepSize,
                horizon,
                (int) Math.max(UncertaintyAnalyzer.BASE_GRID, needed),
                limits.bandFraction());
    }

    private static void requireDelayWithinCap(double delay, double horizon) {
        if (delay > MAX_DELAY_HORIZONS * horizon) {
            throw new CapExceededException(
                    CapExceededException.Option.INPUT_DELAY,
                    -1,
                    String.format(
                            "the input delay must be at most %.6g s (%s nominal horizon), got %.6g s",
                            SafeRounding.atMost(MAX_DELAY_HORIZONS * horizon, ADVICE_DIGITS),
                            fmt(MAX_DELAY_HORIZONS),
                            delay));
        }
    }

    private static void requireIntervals(double ts, double horizon, CapExceededException.Option option) {
        if (!fitsIntervals(ts, horizon)) {
            throw new CapExceededException(
                    option,
                    -1,
                    String.format(
                            "the sampled simulation over %.6g s at"
                                    + " Ts = %.6g s needs %.0f sample intervals, more than the cap %d: use Ts >= %.6g s",
                            horizon,
                            ts,
                            Math.ceil(horizon / ts),
                            DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS,
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

    static GridMetrics metricsOf(
            DenseTrajectory trajectory,
            CanonicalPlant plant,
            FeedbackGains gains,
            double stepSize,
            AcceptanceLimits limits) {
        // the sampled loop's DC gain equals the continuous one: at rest x2 = 0 and u = kr r - k1 x1 = a0 x1 / b
        return GridMetrics.of(
                trajectory, LoopMatrices.unitStepFinalValue(plant, gains) * stepSize, limits.bandFraction());
    }

    static String fmt(double value) {
        return value == Math.rint(value) ? String.valueOf((long) value) : String.valueOf(value);
    }
}
