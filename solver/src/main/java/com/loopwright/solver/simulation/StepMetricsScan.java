package com.loopwright.solver.simulation;

import java.util.function.BiFunction;

/**
 * The scans behind {@link StepResponseMetrics}, fed sample by sample by
 * {@link StepSimulator#stream}: first times of the normalised output z at 10% and 90%, its exit
 * from the settling band, the maxima of z and -z (overshoot and undershoot, both refined between
 * samples), and the maxima of u and -u. Only the previous sample and
 * the intervals that may hold events are kept, so memory grows with the events, not the samples.
 *
 * <p>The rise scan refines during the pass. A failure there, or in building the propagation
 * between samples, is deferred until {@link #throwDeferred}, after the simulator's own checks, so
 * the exceptions come in the order of a scan over recorded samples: the simulator's first.
 */
final class StepMetricsScan implements StepSampleSink {

    /** The rise-start and rise-end levels, in that order. */
    private final RiseScan rise;

    private final SettlingScan settling;
    private final MaximumScan outputMaximum;
    /** The maximum of -z: the undershoot. */
    private final MaximumScan outputMinimum;

    private final MaximumScan controlMaximum;
    private final MaximumScan controlMinimum;
    /** A failure to build the propagation between samples, reported after the pass. */
    private RuntimeException propagationFailure;

    /** x_(k-1) while sample k is handled: the simulator's array, unchanged until then. */
    private double[] previousState;

    private double previousOutput;
    private double previousOutputRate;
    private double previousControl;
    private double previousControlRate;

    /**
     * @param outputWeights w of z = w . x
     * @param riseStartLevel the level of z whose first time starts the rise
     * @param riseEndLevel the higher level of z whose first time ends the rise
     * @param bandHalfWidth settling band around z = 1
     */
    StepMetricsScan(
            LinearLoop loop,
            double stepSize,
            double horizonSeconds,
            int samples,
            double[] outputWeights,
            double riseStartLevel,
            double riseEndLevel,
            double bandHalfWidth,
            BiFunction<LinearLoop, Double, SubIntervalPropagator> propagators) {
        int n = loop.stateDimension();
        SubIntervalPropagator propagator = null;
        try {
            propagator = propagators.apply(loop, stepSize);
        } catch (RuntimeException e) {
            propagationFailure = e;
        }
        ExactTrajectory trajectory = new ExactTrajectory(loop, stepSize, horizonSeconds, samples, propagator);
        SignalBetweenSamples output = new SignalBetweenSamples(trajectory, outputWeights, 0.0, 1.0);
        SignalBetweenSamples negatedOutput = new SignalBetweenSamples(trajectory, outputWeights, 0.0, -1.0);
        double[] cControl = loop.cControl().data;
        double feedthrough = loop.dControl() * stepSize;
        SignalBetweenSamples control = new SignalBetweenSamples(trajectory, cControl, feedthrough, 1.0);
        SignalBetweenSamples negatedControl = new SignalBetweenSamples(trajectory, cControl, feedthrough, -1.0);
        this.rise = new RiseScan(output, riseStartLevel, riseEndLevel);
        this.settling = new SettlingScan(output, n, 1.0, bandHalfWidth);
        this.outputMaximum = new MaximumScan(output, n);
        this.outputMinimum = new MaximumScan(negatedOutput, n);
        this.controlMaximum = new MaximumScan(control, n);
        this.controlMinimum = new MaximumScan(negatedControl, n);
        if (propagationFailure != null) {
            rise.abandon();
        }
    }

    @Override
    public void accept(
            int k, double[] state, double outputValue, double outputRate, double controlValue, double controlRate) {
        // Kept small, so that the simulator's loop can inline it with the scans' per-sample tests.
        if (k == 0) {
            first(state, outputValue, outputRate, controlValue, controlRate);
            return;
        }
        int interval = k - 1;
        double[] from = previousState;
        rise.interval(interval, from, previousOutput, previousOutputRate, outputValue, outputRate);
        settling.interval(interval, from, previousOutput, previousOutputRate, outputValue, outputRate);
        outputMaximum.interval(interval, from, previousOutput, previousOutputRate, outputValue, outputRate);
        outputMinimum.interval(interval, from, -previousOutput, -previousOutputRate, -outputValue, -outputRate);
        controlMaximum.interval(interval, from, previousControl, previousControlRate, controlValue, controlRate);
        controlMinimum.interval(interval, from, -previousControl, -previousControlRate, -controlValue, -controlRate);
        settling.sample(k, outputValue);
        previousState = state;
        previousOutput = outputValue;
        previousOutputRate = outputRate;
        previousControl = controlValue;
        previousControlRate = controlRate;
    }

    /** Sample 0. */
    private void first(double[] state, double outputValue, double outputRate, double controlValue, double controlRate) {
        rise.firstSample(outputValue);
        outputMaximum.firstSample(outputValue);
        outputMinimum.firstSample(-outputValue);
        controlMaximum.firstSample(controlValue);
        controlMinimum.firstSample(-controlValue);
        settling.sample(0, outputValue);
        previousState = state;
        previousOutput = outputValue;
        previousOutputRate = outputRate;
        previousControl = controlValue;
        previousControlRate = controlRate;
    }

    /** Rethrows a failure deferred during the pass. */
    void throwDeferred() {
        if (propagationFailure != null) {
            throw propagationFailure;
        }
        if (rise.failure() != null) {
            throw rise.failure();
        }
    }

    /** First time z reaches the rise-start level, -1 if not within the horizon. */
    double riseStartSeconds() {
        return rise.timeSeconds(0);
    }

    /** First time z reaches the rise-end level, -1 if not within the horizon. */
    double riseEndSeconds() {
        return rise.timeSeconds(1);
    }

    /** Exit time from the settling band, -1 if z is outside it at the horizon. */
    double settlingSeconds() {
        return settling.timeSeconds();
    }

    MaximumScan.Point outputMaximum() {
        return outputMaximum.maximum();
    }

    /** The maximum of -z: its time and the value of -z there. */
    MaximumScan.Point outputMinimumNegated() {
        return outputMinimum.maximum();
    }

    MaximumScan.Point controlMaximum() {
        return controlMaximum.maximum();
    }

    /** The maximum of -u: its time and the value of -u there. */
    MaximumScan.Point controlMinimumNegated() {
        return controlMinimum.maximum();
    }
}
