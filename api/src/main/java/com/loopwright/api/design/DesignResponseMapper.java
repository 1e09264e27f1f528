package com.loopwright.api.design;

import com.loopwright.api.loop.LoopResponseMapper;
import com.loopwright.api.result.Gain;
import com.loopwright.api.result.GammaConditions;
import com.loopwright.api.result.GammaInterval;
import com.loopwright.api.result.IntervalEnd;
import com.loopwright.api.result.Matrices;
import com.loopwright.api.result.Pole;
import com.loopwright.api.result.Riccati;
import com.loopwright.api.result.Simulated;
import com.loopwright.api.result.SpecCheck;
import com.loopwright.api.result.Target;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.GammaBound;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.design.Verification;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.NumericRiccati;
import com.loopwright.solver.pipeline.StateSpaceDesign;
import com.loopwright.solver.robustness.RobustnessOptions;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;

/** Solver results to the wire records of POST /v1/designs. */
public final class DesignResponseMapper {

    /** The response of a design without robustness checks to feed the sanity notes. */
    public DesignResponse toResponse(
            ValidatedDesign request,
            DesignReport report,
            StateSpaceDesign callerCoordinates,
            com.loopwright.api.robustness.RobustnessResponse robustness) {
        return toResponse(request, report, callerCoordinates, robustness, null);
    }

    /**
     * @param callerCoordinates the design in the caller's state-space coordinates (null unless the plant was given
     *                          as a state space)
     * @param robustness        the robustness section (null when the request did not ask for it)
     * @param verifyOptions     the robustness checks asked for (null when none): their actuator limit and sample
     *                          period feed the sanity notes
     */
    public DesignResponse toResponse(
            ValidatedDesign request,
            DesignReport report,
            StateSpaceDesign callerCoordinates,
            com.loopwright.api.robustness.RobustnessResponse robustness,
            RobustnessOptions verifyOptions) {
        return toResponse(request, report, callerCoordinates, robustness, verifyOptions, null);
    }

    /**
     * @param loop the sections of the loop with integral action and/or an observer (null for the plain loop)
     */
    public DesignResponse toResponse(
            ValidatedDesign request,
            DesignReport report,
            StateSpaceDesign callerCoordinates,
            com.loopwright.api.robustness.RobustnessResponse robustness,
            RobustnessOptions verifyOptions,
            LoopResponseMapper.Sections loop) {
        return toResponse(request, report, callerCoordinates, robustness, verifyOptions, loop, null);
    }

    /**
     * @param loop   the sections of the loop with integral action and/or an observer (null for the plain loop)
     * @param robust the robust design's member (null unless the request asked for a robust design)
     */
    public DesignResponse toResponse(
            ValidatedDesign request,
            DesignReport report,
            StateSpaceDesign callerCoordinates,
            com.loopwright.api.robustness.RobustnessResponse robustness,
            RobustnessOptions verifyOptions,
            LoopResponseMapper.Sections loop,
            RobustDesign robust) {
        ClosedFormDesign design = report.design();
        Verification verification = report.verification();
        TargetDynamics target = design.target();
        NumericRiccati numeric = report.numericRiccati();
        StepMetrics metrics = report.stepMetrics();
        String timeSpecName = request.timeSpecPointer().substring("/spec/".length());
        DesignNotes notes = DesignNotes.of(
                report,
                100 * request.spec().overshootFraction(),
                verifyOptions == null ? null : verifyOptions.actuatorLimit(),
                verifyOptions == null ? null : verifyOptions.samplePeriod(),
                ModelMapper.conditionNote(request.resolvedPlant()));
        double wn = target.naturalFrequencyRadPerSec();
        return new DesignResponse(
                new DesignResponse.Plant(
                        design.plant().a0(),
                        design.plant().a1(),
                        design.plant().b(),
                        design.plant().d()),
                new Target(
                        target.dampingRatio(),
                        wn,
                        target.poles().stream()
                                .map(p -> new Pole(p.re(), p.im()))
                                .toList(),
                        List.of(),
                        // s^2 + 2 zeta wn s + wn^2, highest power first
                        List.of(1.0, 2 * target.dampingRatio() * wn, wn * wn),
                        report.inversion().handbookNaturalFrequencyRadPerSec(),
                        List.of("overshootPercent", timeSpecName)),
                new Riccati(
                        Matrices.symmetric2(design.p11(), design.p12(), design.p22()),
                        verification.closedFormResidual(),
                        new com.loopwright.api.result.NumericRiccati(
                                Matrices.symmetric2(numeric.p11(), numeric.p12(), numeric.p22()),
                                numeric.relativeResidual(),
                                numeric.relativeDifference(),
                                numeric.iterations()),
                        null,
                        null,
                        null),
                design.gammaBounds().stream().map(GammaConditions::toWire).toList(),
                List.of(gammaInterval(design)),
                design.gammaMin(),
                design.gamma(),
                List.of(design.rho1(), design.rho2()),
                new Gain(
                        List.of(design.positionGain(), design.velocityGain()),
                        design.referenceGain(),
                        "u = kr*r - (k1*x1 + k2*x2)"),
                new Simulated(
                        metrics.riseTimeSeconds(),
                        metrics.settlingTimeSeconds(),
                        metrics.overshootPercent(),
                        metrics.undershootPercent(),
                        metrics.peakTimeSeconds(),
                        metrics.steadyStateError(),
                        metrics.peakControl(),
                        report.stepSize(),
                        100 * report.bandFraction(),
                        report.horizonSeconds(),
                        report.samples()),
                new com.loopwright.api.result.Verification(
                        verification.hinfNorm().value(),
                        verification.hinfNorm().peakFrequencyRadPerSec(),
                        null,
                        verification.certified(),
                        design.positionPerDisturbanceBound().isPresent()
                                ? design.positionPerDisturbanceBound().getAsDouble()
                                : null,
                        verification.specsMet(),
                        verification.specChecks().stream()
                                .map(c -> new SpecCheck(c.spec(), c.requested(), c.simulated(), c.met()))
                                .toList()),
                loop == null ? notes.texts() : loop.appendNotes(notes.texts()),
                loop == null ? notes.codes() : loop.appendCodes(notes.codes()),
                Cautions.ALL,
                ModelMapper.toModel(request.resolvedPlant(), design, callerCoordinates),
                robustness,
                loop == null ? null : loop.law(),
                loop == null ? null : loop.observer(),
                loop == null ? null : loop.outputFeedback(),
                loop == null ? null : loop.loadStep(),
                robust);
    }

    /**
     * The feasible gamma set of the closed-form design, [gammaMin, unbounded): every requirement is
     * d^2/gamma^2 &lt;= D, so it holds for every gamma above its bound; the binding requirement ends it below.
     */
    static GammaInterval gammaInterval(ClosedFormDesign design) {
        IntervalEnd lower = design.gammaBounds().stream()
                .filter(GammaBound::binding)
                .findFirst()
                .map(b -> new IntervalEnd(
                        GammaConditions.wireName(b.condition()),
                        GammaConditions.state(b.condition(), b.stateIndex()),
                        b.meaning()))
                .orElse(null);
        return new GammaInterval(design.gammaMin(), null, true, lower, null);
    }
}
