package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.BodeSeries;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.design.LoopMargins;
import com.loopwright.solver.frequency.LoopFrequencyAnalyzer;
import com.loopwright.solver.frequency.RationalLoop;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.StepEnvelope;
import com.loopwright.solver.robustness.UnstableLoopException;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponse;
import com.loopwright.solver.simulation.StepSimulator;

/**
 * The front door of the data a design's figures draw: the step and control series, the Bode response with its
 * margins, and the step band over a parameter box. A computation that leaves its range is a
 * {@link SolverFailure} (FIGURE_NOT_COMPUTABLE, or UNSTABLE_LOOP for a band around an unstable loop).
 * Stateless and thread-safe.
 */
public final class FigurePipeline {

    /** Samples of the drawn step and control series. */
    public static final int PLOT_SAMPLES = 600;
    /** Frequency points of the Bode figure. */
    public static final int BODE_POINTS = 400;
    /** Bode window: this many decades either side of the natural frequency. */
    public static final double BODE_DECADES = 2;
    /** The window reaches at least this factor beyond a marked crossover. */
    public static final double BODE_MARKER_ROOM = 3;

    private final StepSimulator simulator = new StepSimulator();
    private final LoopFrequencyAnalyzer frequency = new LoopFrequencyAnalyzer();
    private final StepEnvelope envelope = new StepEnvelope();

    /** The step of the designed loop on {@link #PLOT_SAMPLES} points over the design's horizon. */
    public StepSeries step(DesignReport report) {
        try {
            ClosedFormDesign d = report.design();
            LinearLoop loop = LinearLoop.ofStep(
                    d.plant(), new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain()));
            StepResponse step = simulator.simulate(loop, report.stepSize(), report.horizonSeconds(), PLOT_SAMPLES);
            return new StepSeries(step.timeSeconds(), step.output(), step.control());
        } catch (IllegalArgumentException e) {
            throw notComputable(e);
        }
    }

    /**
     * L(jw) of the loop broken at the plant input on {@link #BODE_POINTS} log-spaced points, from
     * {@link #BODE_DECADES} decades below to as many above wn, widened to show each marked crossover with
     * {@link #BODE_MARKER_ROOM} to spare; with the closed-form margins of POST /v1/verifications so that the figure
     * and the report agree.
     */
    public BodeData bode(DesignReport report) {
        try {
            ClosedFormDesign d = report.design();
            RationalLoop loop = RationalLoop.atPlantInput(d.plant(), d.positionGain(), d.velocityGain());
            LoopMargins margins = frequency.margins(
                    d.plant(), new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain()), 0);
            double wn = d.target().naturalFrequencyRadPerSec();
            double low = wn * Math.pow(10, -BODE_DECADES);
            double high = wn * Math.pow(10, BODE_DECADES);
            for (Double marked : new Double[] {margins.crossoverRadPerSec(), margins.gainMarginRadPerSec()}) {
                if (marked != null && marked > 0) {
                    low = Math.min(low, marked / BODE_MARKER_ROOM);
                    high = Math.max(high, marked * BODE_MARKER_ROOM);
                }
            }
            BodeSeries series = frequency.sample(loop, low, high, BODE_POINTS);
            return new BodeData(series, margins, low, high);
        } catch (IllegalArgumentException e) {
            throw notComputable(e);
        }
    }

    /**
     * The step band over a parameter box: its corners plus up to {@link StepEnvelope#MAX_INTERIOR_SAMPLES}
     * seeded interior samples, on {@link #PLOT_SAMPLES} points.
     */
    public StepEnvelope.Band band(DesignReport report, ParameterBox box, int monteCarloSamples, long seed) {
        ClosedFormDesign d = report.design();
        int interior = Math.min(monteCarloSamples, StepEnvelope.MAX_INTERIOR_SAMPLES);
        try {
            return envelope.sweep(
                    box,
                    d.plant(),
                    new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain()),
                    report.stepSize(),
                    report.horizonSeconds(),
                    PLOT_SAMPLES,
                    interior,
                    seed);
        } catch (UnstableLoopException e) {
            throw SolverFailure.of(SolverFailure.Kind.UNSTABLE_LOOP, e.getMessage(), e);
        } catch (IllegalArgumentException e) {
            throw notComputable(e);
        }
    }

    private static SolverFailure notComputable(IllegalArgumentException e) {
        return SolverFailure.of(SolverFailure.Kind.FIGURE_NOT_COMPUTABLE, e.getMessage(), e);
    }
}
