package com.loopwright.api.highorder;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.design.DesignNotes;
import com.loopwright.api.loop.LoopResponseMapper;
import com.loopwright.api.result.Gain;
import com.loopwright.api.result.GammaConditions;
import com.loopwright.api.result.GammaInterval;
import com.loopwright.api.result.IntervalEnd;
import com.loopwright.api.result.Matrices;
import com.loopwright.api.result.NumericRiccati;
import com.loopwright.api.result.Pole;
import com.loopwright.api.result.Riccati;
import com.loopwright.api.result.Simulated;
import com.loopwright.api.result.SpecCheck;
import com.loopwright.api.result.Target;
import com.loopwright.api.result.Verification;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.HighOrderStep;
import com.loopwright.solver.design.HighOrderVerification;
import com.loopwright.solver.design.SpecMatch;
import com.loopwright.solver.pipeline.HighOrderPipeline;
import com.loopwright.solver.plant.TwoStateModel;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Solver results of a high-order design to the response records. */
public final class HighOrderResponseMapper {

    /**
     * Notes from the gamma search passed on: with the at most five notes of the mapper the response carries at
     * most 16 notes in all (the contract's maxItems).
     */
    static final int MAX_DESIGN_NOTES = 11;

    /** Note code: P, gains and weights are in the request's companion coordinates (every order-n design). */
    public static final String COMPANION_COORDINATES = "companionCoordinates";
    /** Note code: the simulated step misses the specs; matchSpecs would adjust the dominant pair. */
    public static final String SPECS_MISSED_TRY_MATCH_SPECS = "specsMissedTryMatchSpecs";
    /** Note code: a note of the feasible-gamma search. */
    public static final String GAMMA_SEARCH = "gammaSearch";
    /** Note code: the state space was brought to companion form. */
    public static final String STATE_SPACE_TRANSFORM = "stateSpaceTransform";
    /** Note code: an ill-conditioned controllability matrix (the order-2 code for the same warning). */
    public static final String PLANT_CONDITIONING = DesignNotes.PLANT_CONDITIONING;
    /** Note code: an overshoot below 0.1 % (the order-2 code and text). */
    public static final String OVERSHOOT_LOOKS_LIKE_FRACTION = DesignNotes.OVERSHOOT_LOOKS_LIKE_FRACTION;

    /** Formats the design, its verification and the spec check the solver computed (HighOrderPipeline). */
    public HighOrderDesignResponse toResponse(ValidatedHighOrderDesign request, HighOrderPipeline.Result result) {
        return toResponse(request, result, null);
    }

    /** @param loop the sections of the loop with integral action and/or an observer (null for the plain loop) */
    public HighOrderDesignResponse toResponse(
            ValidatedHighOrderDesign request, HighOrderPipeline.Result result, LoopResponseMapper.Sections loop) {
        return toResponse(request, result, loop, null);
    }

    /**
     * @param loop   the sections of the loop with integral action and/or an observer (null for the plain loop)
     * @param robust the robust member (null without a box); the design is then the one of its chosen target, and
     *               no note suggests matchSpecs (the box search chose the dominant pair)
     */
    HighOrderDesignResponse toResponse(
            ValidatedHighOrderDesign request,
            HighOrderPipeline.Result result,
            LoopResponseMapper.Sections loop,
            HighOrderRobustDesign robust) {
        boolean fromStateSpace = result.fromStateSpace();
        SpecMatch match = result.match();
        HighOrderDesign design = result.design();
        HighOrderVerification verification = result.verification();
        TargetDynamics dominant = design.poles().dominant();
        int n = design.plant().order();
        Double controllabilityCondition = result.controllabilityCondition();
        HighOrderDesignResponse.Coordinates coordinates = new HighOrderDesignResponse.Coordinates(
                fromStateSpace ? "stateSpace" : "companion",
                CoefficientOrder.monicHighestFirst(design.plant().denominator()),
                CoefficientOrder.numeratorHighestFirst(design.plant().numerator()),
                design.plant().b(),
                boxed(design.plant().disturbance()),
                Matrices.rows(result.toPlant()),
                boxed(result.plantGain()),
                controllabilityCondition);
        HighOrderStep step = verification.step();
        boolean specsMet = result.specCheck().met();
        HighOrderDesignResponse.SpecMatching matching = match == null
                ? new HighOrderDesignResponse.SpecMatching(
                        false,
                        0,
                        result.specCheck().settlingResidual(),
                        result.specCheck().overshootResidualPoints(),
                        dominant.dampingRatio(),
                        dominant.naturalFrequencyRadPerSec())
                : new HighOrderDesignResponse.SpecMatching(
                        true,
                        match.iterations(),
                        match.settlingResidual(),
                        match.overshootResidualPoints(),
                        match.startingTarget().dampingRatio(),
                        match.startingTarget().naturalFrequencyRadPerSec());
        double overshootPercent = 100 * request.spec().overshootFraction();
        List<String> notes = new ArrayList<>();
        List<String> codes = new ArrayList<>();
        note(
                notes,
                codes,
                COMPANION_COORDINATES,
                "P, the gains and the weights are in the companion coordinates of the request: z_1 is the state"
                        + " the output row weights first, z_n the state u drives.");
        if (!specsMet && match == null && robust == null) {
            note(
                    notes,
                    codes,
                    SPECS_MISSED_TRY_MATCH_SPECS,
                    "the zeros and auxiliary poles move the simulated step away from the second-order formulas;"
                            + " send matchSpecs: true to adjust the dominant pair until the simulated loop meets the"
                            + " specs.");
        }
        design.notes().stream().limit(MAX_DESIGN_NOTES).forEach(text -> note(notes, codes, GAMMA_SEARCH, text));
        if (fromStateSpace) {
            note(
                    notes,
                    codes,
                    STATE_SPACE_TRANSFORM,
                    "the state space was brought to companion form by x = T z (coordinates.toPlant); the weights"
                            + " rho_i weight the companion states z = T^-1 x, and coordinates.plantGain is the gain"
                            + " on x.");
            if (controllabilityCondition > TwoStateModel.CONDITION_NOTE_THRESHOLD) {
                note(
                        notes,
                        codes,
                        PLANT_CONDITIONING,
                        String.format(
                                Locale.US,
                                "The controllability matrix [B2, A B2, ...] has condition number"
                                        + " %.3g (above %.0e): coordinates.plantGain and toPlant may have lost up to"
                                        + " %.0f of their about 16 significant digits. Rescale the states or check"
                                        + " the model.",
                                controllabilityCondition,
                                TwoStateModel.CONDITION_NOTE_THRESHOLD,
                                Math.ceil(Math.log10(controllabilityCondition))));
            }
        }
        DesignNotes.overshootFractionNote(overshootPercent, dominant.dampingRatio())
                .ifPresent(text -> note(notes, codes, OVERSHOOT_LOOKS_LIKE_FRACTION, text));
        double wn = dominant.naturalFrequencyRadPerSec();
        return new HighOrderDesignResponse(
                n,
                coordinates,
                new Target(
                        dominant.dampingRatio(),
                        wn,
                        poles(dominant.poles()),
                        poles(design.poles().auxiliary()),
                        CoefficientOrder.monicHighestFirst(design.poles().coefficients()),
                        null,
                        null),
                matching,
                new Riccati(
                        Matrices.rows(design.solution().p()),
                        design.solution().relativeResidual(),
                        new NumericRiccati(
                                Matrices.rows(verification.numeric().p()),
                                verification.numeric().relativeResidual(),
                                verification.relativeDifference(),
                                verification.numeric().iterations()),
                        design.solution().reciprocalCondition(),
                        design.solution().newtonSteps(),
                        design.bisectionSteps()),
                design.gammaBounds().stream().map(GammaConditions::toWire).toList(),
                design.feasibleSet().stream()
                        .map(HighOrderResponseMapper::interval)
                        .toList(),
                design.gammaMin(),
                design.gamma(),
                boxed(design.weights()),
                new Gain(boxed(design.gain()), design.referenceGain(), "u = kr*r - sum(k_i*z_i)"),
                new Simulated(
                        step.metrics().riseTimeSeconds(),
                        step.metrics().settlingTimeSeconds(),
                        step.metrics().overshootPercent(),
                        step.undershootPercent(),
                        step.metrics().peakTimeSeconds(),
                        step.metrics().steadyStateError(),
                        step.metrics().peakControl(),
                        request.stepSize(),
                        100 * request.bandFraction(),
                        step.horizonSeconds(),
                        step.samples()),
                new Verification(
                        verification.norm().value(),
                        verification.norm().peakFrequencyRadPerSec(),
                        HighOrderPipeline.NORM_RELATIVE_TOLERANCE,
                        verification.certified(),
                        null,
                        specsMet,
                        specChecks(request, step, overshootPercent)),
                loop == null ? notes : loop.appendNotes(notes),
                loop == null ? codes : loop.appendCodes(codes),
                Cautions.ALL,
                loop == null ? null : loop.law(),
                loop == null ? null : loop.observer(),
                loop == null ? null : loop.outputFeedback(),
                loop == null ? null : loop.loadStep(),
                robust);
    }

    /**
     * The three specs against the simulated step, with the tolerances the pipeline's spec check uses
     * (HighOrderPipeline.specCheck): settling within ts (1 + SETTLING_TOLERANCE), overshoot within the spec plus
     * OVERSHOOT_TOLERANCE_POINTS, undershoot within its cap.
     */
    static List<SpecCheck> specChecks(ValidatedHighOrderDesign request, HighOrderStep step, double overshootPercent) {
        double ts = ((TimeSpec.SettlingTime) request.spec().timeSpec()).seconds();
        double settling = step.metrics().settlingTimeSeconds();
        double overshoot = step.metrics().overshootPercent();
        return List.of(
                new SpecCheck(
                        "overshootPercent",
                        overshootPercent,
                        overshoot,
                        overshoot <= overshootPercent + HighOrderPipeline.OVERSHOOT_TOLERANCE_POINTS),
                new SpecCheck(
                        "settlingTime", ts, settling, settling <= ts * (1 + HighOrderPipeline.SETTLING_TOLERANCE)),
                new SpecCheck(
                        "maxUndershootPercent",
                        request.maxUndershootPercent(),
                        step.undershootPercent(),
                        step.undershootPercent() <= request.maxUndershootPercent()));
    }

    private static void note(List<String> notes, List<String> codes, String code, String text) {
        notes.add(text);
        codes.add(code);
    }

    private static GammaInterval interval(com.loopwright.solver.design.GammaInterval i) {
        return new GammaInterval(
                i.lowerGamma(),
                i.unbounded() ? null : i.upperGamma(),
                i.unbounded(),
                end(i.lowerBinding()),
                i.unbounded() ? null : end(i.upperBinding()));
    }

    private static IntervalEnd end(com.loopwright.solver.design.GammaInterval.GammaEnd end) {
        return new IntervalEnd(
                GammaConditions.wireName(end.condition()),
                GammaConditions.state(end.condition(), end.stateIndex()),
                end.meaning());
    }

    private static List<Pole> poles(List<TargetDynamics.Pole> poles) {
        return poles.stream().map(p -> new Pole(p.re(), p.im())).toList();
    }

    private static List<Double> boxed(double[] values) {
        return Matrices.boxed(values);
    }
}
