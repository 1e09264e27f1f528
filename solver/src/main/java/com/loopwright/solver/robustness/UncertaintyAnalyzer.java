package com.loopwright.solver.robustness;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.norm.TwoStatePeakGain;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.StepResponseMetrics;
import com.loopwright.solver.simulation.StepSimulator;
import com.loopwright.solver.simulation.TwoStateStepMetrics;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import org.ejml.data.DMatrixRMaj;

/**
 * Evaluates the nominal gains on every corner of a parameter box and on seeded uniform Monte Carlo samples inside
 * it. Each case gets the exact step metrics of the two-state loop in closed form ({@link TwoStateStepMetrics}: the
 * metrics {@link StepResponseMetrics} measures over a window of {@value LoopMatrices#HORIZON_PER_TIME_CONSTANT}
 * slowest time constants, without the time simulation) and the exact H-infinity norm from w to the performance
 * output ({@link TwoStatePeakGain}), a few microseconds per case. Saturation, delay and sampling are not part of
 * this check; their checks keep the simulation. The samples are those of {@link ParameterSampler} with the given seed, so the same request
 * gives the same samples bit for bit, and the same ones the uncertainty-band figure draws.
 */
public final class UncertaintyAnalyzer {

    /** Cap on Monte Carlo samples. */
    public static final int MAX_SAMPLES = 2000;
    /** Grid used to bracket the exact step events (the metrics do not depend on it). */
    static final int BASE_GRID = 2000;

    private final TwoStatePeakGain peakGains = new TwoStatePeakGain();

    /**
     * @param performanceOutput C_z with z = C_z x (p x 2)
     */
    public UncertaintyReport analyze(
            ParameterBox box,
            FeedbackGains gains,
            double stepSize,
            AcceptanceLimits limits,
            DMatrixRMaj performanceOutput,
            int samples,
            long seed) {
        if (samples < 0 || samples > MAX_SAMPLES) {
            throw new IllegalArgumentException("samples must be 0 to " + MAX_SAMPLES);
        }
        List<UncertainCase> corners = new ArrayList<>();
        for (CanonicalPlant corner : box.corners()) {
            corners.add(evaluate(corner, true, gains, stepSize, limits, performanceOutput));
        }
        List<UncertainCase> all = new ArrayList<>(corners);
        ParameterSampler sampler = new ParameterSampler(box, seed);
        for (int s = 0; s < samples; s++) {
            Cancellation.checkpoint(); // a Monte Carlo sample is the unit of cancellation
            double[] p = sampler.next();
            all.add(evaluate(ParameterBox.plant(p), false, gains, stepSize, limits, performanceOutput));
        }
        return summarize(corners, all, samples, seed, limits);
    }

    /**
     * The report of cases evaluated elsewhere (the robust loop search simulates them): the meeting fraction, the
     * distributions and the worst case, as {@link #analyze} reports its own.
     *
     * @param corners the corners, in the box's order
     * @param all     the corners followed by the samples
     */
    public UncertaintyReport summarize(
            List<UncertainCase> corners, List<UncertainCase> all, int samples, long seed, AcceptanceLimits limits) {
        int unstable = (int) all.stream().filter(c -> !c.stable()).count();
        Double fraction = limits.judges()
                ? (double) all.stream().filter(UncertainCase::meetsSpec).count() / all.size()
                : null;
        UncertainCase worst = null;
        if (limits.judges()) {
            double worstScore = Double.NEGATIVE_INFINITY;
            for (UncertainCase c : all) {
                double score = score(c, limits);
                if (score > worstScore) {
                    worstScore = score;
                    worst = c;
                }
            }
        }
        return new UncertaintyReport(
                corners.size(),
                samples,
                seed,
                unstable,
                fraction,
                summary(all, UncertainCase::settlingTimeSeconds),
                summary(all, UncertainCase::riseTimeSeconds),
                summary(all, UncertainCase::overshootPercent),
                summary(all, UncertainCase::peakControl),
                summary(all, UncertainCase::disturbanceGain),
                worst,
                corners);
    }

    UncertainCase evaluate(
            CanonicalPlant plant,
            boolean corner,
            FeedbackGains gains,
            double stepSize,
            AcceptanceLimits limits,
            DMatrixRMaj performanceOutput) {
        if (!LoopMatrices.stable(plant, gains)) {
            return new UncertainCase(plant, corner, false, null, null, null, null, null, false);
        }
        StepMetrics step = null;
        try {
            if (measurable(plant, gains)) {
                step = TwoStateStepMetrics.measure(plant, gains, stepSize, limits.bandFraction());
            }
        } catch (IllegalArgumentException e) {
            step = null; // not measurable in double precision (reported as a missing metric)
        }
        Double gain = null;
        try {
            gain = plant.d() == 0
                    ? 0.0
                    : peakGains
                            .compute(
                                    LoopMatrices.closedLoop(plant, gains),
                                    LoopMatrices.disturbanceInput(plant),
                                    performanceOutput)
                            .value();
        } catch (RuntimeException e) {
            gain = null;
        }
        if (step == null) {
            return new UncertainCase(plant, corner, true, null, null, null, null, gain, false);
        }
        boolean meets = limits.met(step.settlingTimeSeconds(), step.riseTimeSeconds(), step.overshootPercent());
        return new UncertainCase(
                plant,
                corner,
                true,
                step.settlingTimeSeconds(),
                step.riseTimeSeconds(),
                step.overshootPercent(),
                step.peakControl(),
                gain,
                meets);
    }

    /**
     * The range the simulation measured before the closed form took over (a grid of at most
     * {@link StepSimulator#MAX_SAMPLES} samples with {@link StepResponseMetrics#MAX_RADIANS_PER_SAMPLE} per sample
     * over the window), kept so that an answer does not depend on the route: a loop with damping ratio below
     * about 1e-4 stays unmeasured.
     */
    private static boolean measurable(CanonicalPlant plant, FeedbackGains gains) {
        double damping = LoopMatrices.closedLoopDamping(plant, gains);
        double stiffness = LoopMatrices.closedLoopStiffness(plant, gains);
        double oscillation = Math.sqrt(Math.max(0, stiffness - 0.25 * damping * damping));
        double needed = Math.ceil(LoopMatrices.horizonSeconds(damping, stiffness)
                        * oscillation
                        / StepResponseMetrics.MAX_RADIANS_PER_SAMPLE)
                + 2;
        return needed <= StepSimulator.MAX_SAMPLES;
    }

    /** Largest ratio metric / limit; unstable or unmeasured cases score infinity. */
    private static double score(UncertainCase c, AcceptanceLimits limits) {
        if (!c.stable() || c.overshootPercent() == null) {
            return Double.POSITIVE_INFINITY;
        }
        double score = Double.NEGATIVE_INFINITY;
        if (limits.settlingTimeSeconds() != null) {
            score = Math.max(score, c.settlingTimeSeconds() / limits.settlingTimeSeconds());
        }
        if (limits.riseTimeSeconds() != null) {
            score = Math.max(score, c.riseTimeSeconds() / limits.riseTimeSeconds());
        }
        if (limits.overshootPercent() != null) {
            score = Math.max(score, c.overshootPercent() / Math.max(limits.overshootPercent(), 1e-12));
        }
        return score;
    }

    private static MetricSummary summary(List<UncertainCase> cases, Function<UncertainCase, Double> metric) {
        List<UncertainCase> measured =
                cases.stream().filter(c -> metric.apply(c) != null).toList();
        if (measured.isEmpty()) {
            return null;
        }
        double[] values = measured.stream().mapToDouble(c -> metric.apply(c)).toArray();
        UncertainCase worst = measured.get(0);
        for (UncertainCase c : measured) {
            if (metric.apply(c) > metric.apply(worst)) {
                worst = c;
            }
        }
        Arrays.sort(values);
        int n = values.length;
        double median = n % 2 == 1 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
        return new MetricSummary(values[0], median, values[n - 1], worst.plant(), n);
    }
}
