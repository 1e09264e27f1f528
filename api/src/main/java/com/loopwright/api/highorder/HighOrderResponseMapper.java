package com.loopwright.api.highorder;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.design.DesignResponse;
import com.loopwright.solver.design.GammaBound;
import com.loopwright.solver.design.GammaInterval;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.HighOrderStep;
import com.loopwright.solver.design.HighOrderVerification;
import com.loopwright.solver.design.SpecMatch;
import com.loopwright.solver.pipeline.HighOrderPipeline;
import com.loopwright.solver.plant.TwoStateModel;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.ejml.data.DMatrixRMaj;

/** Solver results of a high-order design to the response records. */
public final class HighOrderResponseMapper {

    /** Notes from the gamma search passed on (the response carries at most 16 notes in all). */
    static final int MAX_DESIGN_NOTES = 12;

    /** Formats the design, its verification and the spec check the solver computed (HighOrderPipeline). */
    public HighOrderDesignResponse toResponse(HighOrderPipeline.Result result) {
        boolean fromStateSpace = result.fromStateSpace();
        SpecMatch match = result.match();
        HighOrderDesign design = result.design();
        HighOrderVerification verification = result.verification();
        TargetDynamics dominant = design.poles().dominant();
        int n = design.plant().order();
        List<List<Double>> rows = rows(design.solution().p());
        Double controllabilityCondition = result.controllabilityCondition();
        HighOrderDesignResponse.Coordinates coordinates = new HighOrderDesignResponse.Coordinates(
                fromStateSpace ? "stateSpace" : "companion",
                boxed(design.plant().denominator()),
                boxed(design.plant().numerator()),
                design.plant().b(),
                boxed(design.plant().disturbance()),
                rows(result.toPlant()),
                boxed(result.plantGain()),
                controllabilityCondition);
        List<HighOrderDesignResponse.Bound> bounds = design.gammaBounds().stream()
                .map(HighOrderResponseMapper::bound)
                .toList();
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
        List<String> notes = new ArrayList<>();
        notes.add("P, the gains and the weights are in the companion coordinates of the request: z_1 is the state"
                + " the output row weights first, z_n the state u drives.");
        if (!specsMet && match == null) {
            notes.add("the zeros and auxiliary poles move the simulated step away from the second-order formulas;"
                    + " send matchSpecs: true to adjust the dominant pair until the simulated loop meets the specs.");
        }
        design.notes().stream().limit(MAX_DESIGN_NOTES).forEach(notes::add);
        if (fromStateSpace) {
            notes.add("the state space was brought to companion form by x = T z (coordinates.toPlant); the weights"
                    + " rho_i weight the companion states z = T^-1 x, and coordinates.plantGain is the gain on x.");
            if (controllabilityCondition > TwoStateModel.CONDITION_NOTE_THRESHOLD) {
                notes.add(String.format(
                        Locale.US,
                        "The controllability matrix [B2, A B2, ...] has condition number"
                                + " %.3g (above %.0e): coordinates.plantGain and toPlant may have lost up to %.0f of their"
                                + " about 16 significant digits. Rescale the states or check the model.",
                        controllabilityCondition,
                        TwoStateModel.CONDITION_NOTE_THRESHOLD,
                        Math.ceil(Math.log10(controllabilityCondition))));
            }
        }
        return new HighOrderDesignResponse(
                n,
                coordinates,
                new HighOrderDesignResponse.Target(
                        dominant.dampingRatio(),
                        dominant.naturalFrequencyRadPerSec(),
                        poles(dominant.poles()),
                        poles(design.poles().auxiliary()),
                        boxed(design.poles().coefficients())),
                matching,
                new HighOrderDesignResponse.Riccati(
                        rows,
                        design.solution().relativeResidual(),
                        design.solution().reciprocalCondition(),
                        design.solution().newtonSteps(),
                        design.bisectionSteps(),
                        verification.relativeDifference(),
                        verification.numeric().relativeResidual(),
                        verification.numeric().iterations()),
                bounds,
                design.feasibleSet().stream()
                        .map(HighOrderResponseMapper::interval)
                        .toList(),
                design.gammaMin(),
                design.gamma(),
                boxed(design.weights()),
                new HighOrderDesignResponse.Gain(boxed(design.gain()), design.referenceGain()),
                new HighOrderDesignResponse.Simulated(
                        step.metrics().riseTimeSeconds(),
                        step.metrics().settlingTimeSeconds(),
                        step.metrics().overshootPercent(),
                        step.undershootPercent(),
                        step.metrics().peakControl(),
                        step.horizonSeconds(),
                        step.samples()),
                new HighOrderDesignResponse.Verification(
                        verification.norm().value(),
                        verification.norm().peakFrequencyRadPerSec(),
                        HighOrderPipeline.NORM_RELATIVE_TOLERANCE,
                        verification.certified(),
                        specsMet),
                notes,
                Cautions.ALL);
    }

    private static List<List<Double>> rows(DMatrixRMaj m) {
        List<List<Double>> rows = new ArrayList<>(m.numRows);
        for (int i = 0; i < m.numRows; i++) {
            List<Double> row = new ArrayList<>(m.numCols);
            for (int j = 0; j < m.numCols; j++) {
                row.add(m.get(i, j));
            }
            rows.add(row);
        }
        return rows;
    }

    private static HighOrderDesignResponse.Bound bound(GammaBound b) {
        return new HighOrderDesignResponse.Bound(
                b.condition().name().toLowerCase(), b.stateIndex(), b.meaning(), b.gammaLowerBound(), b.binding());
    }

    private static HighOrderDesignResponse.GammaInterval interval(GammaInterval i) {
        return new HighOrderDesignResponse.GammaInterval(
                i.lowerGamma(),
                i.unbounded() ? null : i.upperGamma(),
                i.unbounded(),
                end(i.lowerBinding()),
                i.unbounded() ? null : end(i.upperBinding()));
    }

    private static HighOrderDesignResponse.IntervalEnd end(GammaInterval.GammaEnd end) {
        return new HighOrderDesignResponse.IntervalEnd(
                end.condition().name().toLowerCase(), end.stateIndex(), end.meaning());
    }

    private static List<DesignResponse.PoleView> poles(List<TargetDynamics.Pole> poles) {
        return poles.stream()
                .map(p -> new DesignResponse.PoleView(p.re(), p.im()))
                .toList();
    }

    private static List<Double> boxed(double[] values) {
        return Arrays.stream(values).boxed().toList();
    }
}
