package com.loopwright.api.design;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.GammaCondition;
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
        return new DesignResponse(
                new DesignResponse.Plant(
                        design.plant().a0(),
                        design.plant().a1(),
                        design.plant().b(),
                        design.plant().d()),
                new DesignResponse.Target(
                        target.dampingRatio(),
                        target.naturalFrequencyRadPerSec(),
                        target.poles().stream()
                                .map(p -> new DesignResponse.PoleView(p.re(), p.im()))
                                .toList(),
                        report.inversion().handbookNaturalFrequencyRadPerSec(),
                        List.of("overshootPercent", timeSpecName)),
                new DesignResponse.Riccati(
                        design.p11(),
                        design.p12(),
                        design.p22(),
                        verification.closedFormResidual(),
                        new DesignResponse.NumericRiccati(
                                numeric.p11(),
                                numeric.p12(),
                                numeric.p22(),
                                numeric.relativeResidual(),
                                numeric.relativeDifference(),
                                numeric.iterations())),
                gammaBounds(design),
                design.gammaMin(),
                design.gamma(),
                new DesignResponse.Weights(design.rho1(), design.rho2()),
                new DesignResponse.Gain(
                        design.positionGain(),
                        design.velocityGain(),
                        design.referenceGain(),
                        "u = kr*r - (k1*x1 + k2*x2)"),
                new DesignResponse.Simulated(
                        metrics.riseTimeSeconds(),
                        metrics.settlingTimeSeconds(),
                        metrics.overshootPercent(),
                        metrics.peakTimeSeconds(),
                        metrics.steadyStateError(),
                        metrics.peakControl(),
                        report.stepSize(),
                        100 * report.bandFraction(),
                        report.horizonSeconds(),
                        report.samples()),
                new DesignResponse.Verification(
                        verification.hinfNorm().value(),
                        verification.hinfNorm().peakFrequencyRadPerSec(),
                        verification.certified(),
                        design.positionPerDisturbanceBound().isPresent()
                                ? design.positionPerDisturbanceBound().getAsDouble()
                                : null,
                        verification.specsMet(),
                        verification.specChecks().stream()
                                .map(c -> new DesignResponse.SpecCheck(c.spec(), c.requested(), c.simulated(), c.met()))
                                .toList()),
                notes.texts(),
                notes.codes(),
                Cautions.ALL,
                ModelMapper.toModel(request.resolvedPlant(), design, callerCoordinates),
                robustness);
    }

    /** Wire name of a gamma condition. */
    public static String wireName(GammaCondition condition) {
        return switch (condition) {
            case POSITION_WEIGHT_REAL -> "positionWeightReal";
            case VELOCITY_WEIGHT_REAL -> "velocityWeightReal";
            case P11_POSITIVE -> "p11Positive";
            case P_POSITIVE_DEFINITE -> "positiveDefinite";
            case STABILIZING_DAMPING -> "stabilizingDamping";
            case STABILIZING_STIFFNESS -> "stabilizingStiffness";
            case WEIGHT_REAL, STABILIZING, INPUT_GAIN, SOLUTION_BRANCH_END ->
                throw new IllegalArgumentException(condition + " is not a closed-form condition");
        };
    }

    private static List<DesignResponse.GammaBoundView> gammaBounds(ClosedFormDesign design) {
        return design.gammaBounds().stream()
                .map(b -> new DesignResponse.GammaBoundView(
                        wireName(b.condition()),
                        b.gammaLowerBound(),
                        b.condition().meaning(),
                        b.binding()))
                .toList();
    }
}
