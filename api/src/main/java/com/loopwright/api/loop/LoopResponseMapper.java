package com.loopwright.api.loop;

import com.loopwright.api.result.Pole;
import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.LoadStepResponse;
import com.loopwright.solver.design.ObserverDesign;
import com.loopwright.solver.design.OutputFeedbackFigures;
import com.loopwright.solver.design.PlantInputMargins;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.pipeline.LoopCheckPipeline;
import com.loopwright.solver.pipeline.RealLoopReport;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/** The solver's real-loop report to the response sections law, observer, outputFeedback and loadStep. Stateless. */
public final class LoopResponseMapper {

    /** Note codes of the loop sections (stable; a client that acts on a note matches its code). */
    public static final String INTEGRAL_ACTION = "integralAction";

    public static final String OBSERVER_DESIGN = "observerDesign";
    public static final String OBSERVER_NORM_EXCEEDS_GAMMA = "observerNormExceedsGamma";
    public static final String OBSERVER_NORM_NOT_CERTIFIED = "observerNormNotCertified";
    public static final String LAW_SUPERSEDES_GAIN = "lawSupersedesGain";
    public static final String OBSERVER_FASTER_THAN_SAMPLING = "observerFasterThanSampling";

    /** Relative slack of the certificate check, the norm's own tolerance (as the solver checks it). */
    private static final double CERTIFICATE_SLACK = 1e-9;

    /**
     * The loop sections and their notes.
     *
     * @param notes plain notes, appended to the response's notes
     * @param codes their codes, index for index
     */
    public record Sections(
            Law law,
            Observer observer,
            OutputFeedback outputFeedback,
            LoadStep loadStep,
            List<String> notes,
            List<String> codes) {
        public Sections {
            notes = List.copyOf(notes);
            codes = List.copyOf(codes);
        }

        /** The response's notes followed by these. */
        public List<String> appendNotes(List<String> before) {
            List<String> all = new ArrayList<>(before);
            all.addAll(notes);
            return all;
        }

        /** The response's note codes followed by these. */
        public List<String> appendCodes(List<String> before) {
            List<String> all = new ArrayList<>(before);
            all.addAll(codes);
            return all;
        }
    }

    /**
     * @param report      the real loop
     * @param coordinates what the state gain's coordinates are, e.g. "canonical x = [x1, x2]"
     * @param lawFormula  the law written in those coordinates
     * @param samplePeriod the sensor's sample period when the caller gave it, else null
     */
    public Sections toSections(RealLoopReport report, String coordinates, String lawFormula, Double samplePeriod) {
        HighOrderDesign design = report.design();
        TrackingLaw law = report.law();
        HInfinityNorm norm = report.stateFeedbackNorm();
        List<String> notes = new ArrayList<>();
        List<String> codes = new ArrayList<>();
        if (law.integralAction()) {
            add(
                    notes,
                    codes,
                    INTEGRAL_ACTION,
                    String.format(
                            Locale.US,
                            "integral action: the integral pole at %.6g 1/s is cancelled by the zero of the reference"
                                    + " feedforward kr = ki / %.6g, so r -> y is the second-order response of the"
                                    + " specs; a constant load leaves no steady offset",
                            law.integralPoleRadPerSec(),
                            -law.integralPoleRadPerSec()));
        }
        add(
                notes,
                codes,
                LAW_SUPERSEDES_GAIN,
                "the law that runs is in law (its gamma, weights and certificate); gain, riccati, gammaBounds,"
                        + " simulated and robustness describe the plain full-state design of the same specs");
        Observer observer = null;
        OutputFeedback outputFeedback = null;
        if (report.observer() != null) {
            ObserverDesign o = report.observer();
            boolean kalman = o.method() == ObserverDesign.Method.STEADY_STATE_KALMAN;
            observer = new Observer(
                    kalman ? LoopLimits.KALMAN : LoopLimits.POLE_MULTIPLE,
                    list(o.gain()),
                    poles(o.poles()),
                    o.processIntensity(),
                    o.measurementIntensity(),
                    o.riccatiRelativeResidual(),
                    o.poleMultiple());
            add(
                    notes,
                    codes,
                    OBSERVER_DESIGN,
                    kalman
                            ? "observer: steady-state Kalman filter from its Riccati equation (process noise at the"
                                    + " disturbance input, measurement noise on the position)"
                            : String.format(
                                    Locale.US,
                                    "observer: poles at %s x the controller poles",
                                    com.loopwright.api.validation.Checks.fmt(o.poleMultiple())));
            double fastest = o.poles().stream()
                    .mapToDouble(p -> Math.hypot(p.re(), p.im()))
                    .max()
                    .orElse(0);
            if (samplePeriod != null && fastest > Math.PI / samplePeriod) {
                add(
                        notes,
                        codes,
                        OBSERVER_FASTER_THAN_SAMPLING,
                        String.format(
                                Locale.US,
                                "the fastest observer pole, %.4g rad/s, is above the Nyquist rate pi/T = %.4g rad/s of"
                                        + " the %.3g s sample period: a sampled observer cannot realize it; choose a"
                                        + " slower observer (poleMultiple, or more measurement noise)",
                                fastest,
                                Math.PI / samplePeriod,
                                samplePeriod));
            }
            OutputFeedbackFigures f = report.outputFeedback();
            outputFeedback = new OutputFeedback(
                    f.disturbanceToPerformanceNorm().value(),
                    f.disturbanceToPerformanceNorm().peakFrequencyRadPerSec(),
                    design.gamma(),
                    f.exceedsGamma(),
                    f.noiseToCommandGain().value(),
                    f.noiseToCommandGain().peakFrequencyRadPerSec(),
                    margins(f.margins()),
                    step(f.step()),
                    report.specCheck().met(),
                    f.largestStepDifference());
            add(
                    notes,
                    codes,
                    f.exceedsGamma() ? OBSERVER_NORM_EXCEEDS_GAMMA : OBSERVER_NORM_NOT_CERTIFIED,
                    String.format(
                            Locale.US,
                            "with the observer the peak gain from w to z is %.6g, %s gamma %.6g: the H-infinity"
                                    + " certificate covers the state-feedback loop only, not the loop with the"
                                    + " observer",
                            f.disturbanceToPerformanceNorm().value(),
                            f.exceedsGamma() ? "above" : "not above",
                            design.gamma()));
        }
        Law wireLaw = new Law(
                lawFormula,
                coordinates,
                list(law.stateGain()),
                law.integralAction() ? law.integralGain() : null,
                law.referenceGain(),
                law.integralPoleRadPerSec(),
                design.gammaMin(),
                design.gamma(),
                list(design.weights()),
                poles(design.poles().all()),
                norm.value(),
                norm.peakFrequencyRadPerSec(),
                norm.value() <= design.gamma() * (1 + CERTIFICATE_SLACK),
                step(report.stateFeedbackStep()),
                margins(report.stateFeedbackMargins()));
        LoadStepResponse l = report.loadStep();
        LoadStep loadStep = new LoadStep(
                l.loadStepSize(),
                l.steadyOffset(),
                law.integralAction(),
                l.simulatedFinalOutput(),
                l.peakDeviation(),
                l.peakTimeSeconds(),
                l.recoveryTimeSeconds(),
                l.peakCommand(),
                l.horizonSeconds(),
                l.samples());
        return new Sections(wireLaw, observer, outputFeedback, loadStep, notes, codes);
    }

    /**
     * The loop section of a verification.
     *
     * @param gamma             the bound to judge peakDisturbanceGain against, or null
     * @param performanceOutput z of peakDisturbanceGain, in words
     */
    public LoopCheck toCheck(LoopCheckPipeline.Report report, Double gamma, String performanceOutput) {
        TrackingLaw law = report.law();
        boolean observed = report.observerGain() != null;
        String state = observed ? "(k1*x1_hat + k2*x2_hat)" : "(k1*x1 + k2*x2)";
        ObserverDesign o = report.observer();
        LoadStepResponse l = report.loadStep();
        return new LoopCheck(
                "the loop as it runs, with the integral gain and/or the observer; the robustness section checks u = kr*r"
                        + " - (k1*x1 + k2*x2) with every state measured",
                law.integralAction() ? "u = kr*r + ki*xi - " + state + ", xi' = r - x1" : "u = kr*r - " + state,
                law.integralGain(),
                law.referenceGain(),
                observed ? list(report.observerGain()) : null,
                o == null
                        ? null
                        : new Observer(
                                LoopLimits.KALMAN,
                                list(o.gain()),
                                poles(o.poles()),
                                o.processIntensity(),
                                o.measurementIntensity(),
                                o.riccatiRelativeResidual(),
                                null),
                performanceOutput,
                report.peakDisturbanceGain().value(),
                report.peakDisturbanceGain().peakFrequencyRadPerSec(),
                gamma,
                gamma == null ? null : report.peakDisturbanceGain().value() > gamma,
                observed ? report.noiseToCommandGain().value() : null,
                observed ? report.noiseToCommandGain().peakFrequencyRadPerSec() : null,
                margins(report.margins()),
                step(report.step()),
                new LoadStep(
                        l.loadStepSize(),
                        l.steadyOffset(),
                        law.integralAction(),
                        l.simulatedFinalOutput(),
                        l.peakDeviation(),
                        l.peakTimeSeconds(),
                        l.recoveryTimeSeconds(),
                        l.peakCommand(),
                        l.horizonSeconds(),
                        l.samples()));
    }

    private static void add(List<String> notes, List<String> codes, String code, String text) {
        notes.add(text);
        codes.add(code);
    }

    static InputMargins margins(PlantInputMargins m) {
        return new InputMargins(
                m.crossoverRadPerSec(),
                m.phaseMarginDegrees(),
                m.delayMarginSeconds(),
                m.gainMargin(),
                m.gainMargin() == null,
                m.gainMarginRadPerSec(),
                m.gainReductionMargin(),
                m.peakSensitivity(),
                m.peakSensitivityRadPerSec(),
                m.closedLoopStable());
    }

    static LoopStep step(StepMetrics s) {
        return new LoopStep(
                s.riseTimeSeconds(),
                s.settlingTimeSeconds(),
                s.overshootPercent(),
                s.undershootPercent(),
                s.peakTimeSeconds(),
                s.steadyStateError(),
                s.peakControl());
    }

    static List<Pole> poles(List<TargetDynamics.Pole> poles) {
        return poles.stream().map(p -> new Pole(p.re(), p.im())).toList();
    }

    private static List<Double> list(double[] values) {
        return Arrays.stream(values).boxed().toList();
    }
}
