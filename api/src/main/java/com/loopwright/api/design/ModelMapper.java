package com.loopwright.api.design;

import com.loopwright.api.plant.PlantNotation;
import com.loopwright.api.plant.ResolvedPlant;
import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.pipeline.CallerLoopLaw;
import com.loopwright.solver.pipeline.StateSpaceDesign;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.TwoStateModel;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.ejml.data.DMatrixRMaj;

/**
 * The {@code model} section of a design response: derived coefficients, units, physical law, and the caller's
 * coordinates as the solver computed them (this class only formats).
 */
final class ModelMapper {

    private ModelMapper() {}

    static DesignResponse.Model toModel(
            ResolvedPlant resolved, ClosedFormDesign design, StateSpaceDesign callerCoordinates) {
        CanonicalPlant plant = resolved.canonical();
        DesignResponse.Plant canonical = new DesignResponse.Plant(plant.a0(), plant.a1(), plant.b(), plant.d());
        PlantNotation notation = resolved.notation();
        PlantNotation.LawTerms law = notation.law();
        return new DesignResponse.Model(
                resolved.form().wireName(),
                canonical,
                units(notation.x1(), notation.x2(), notation.command(), notation.disturbance(), notation.x1Short()),
                resolved.assumptions(),
                law == null
                        ? null
                        : physicalLaw(
                                design,
                                law.command(),
                                law.commandUnit(),
                                law.position(),
                                law.positionUnit(),
                                law.feedforwardMeaning()),
                callerCoordinates == null ? null : stateSpace(callerCoordinates));
    }

    /**
     * The note for a state-space model whose controllability matrix is ill-conditioned (above
     * {@link TwoStateModel#CONDITION_NOTE_THRESHOLD}), or null.
     */
    static String conditionNote(ResolvedPlant resolved) {
        if (!(resolved.source() instanceof TwoStateModel model) || !model.illConditioned()) {
            return null;
        }
        double condition = model.controllabilityCondition();
        return String.format(
                Locale.US,
                "The controllability matrix [B2, A B2] has condition number %.3g (above %.0e):"
                        + " the results in your coordinates (model.stateSpace) may have lost up to %.0f of their about 16"
                        + " significant digits; B2 is nearly an eigenvector of A. Rescale the states or check the model.",
                condition,
                TwoStateModel.CONDITION_NOTE_THRESHOLD,
                Math.ceil(Math.log10(condition)));
    }

    private static DesignResponse.Units units(String x1, String x2, String u, String w, String x1Short) {
        return new DesignResponse.Units(
                x1, x2, u, w, "1/s^2", "1/s", x1Short + "/(s^2 " + u + ")", x1Short + "/(s^2 " + w + ")");
    }

    private static DesignResponse.PhysicalLaw physicalLaw(
            ClosedFormDesign design,
            String command,
            String commandUnit,
            String position,
            String positionUnit,
            String meaning) {
        double k1 = design.positionGain();
        double k2 = design.velocityGain();
        double kr = design.referenceGain();
        double feedforward = design.plant().a0() / design.plant().b();
        String law = String.format(
                Locale.US,
                "%s [%s] = %.6g*(r - %s) - %.6g*%s' + %.6g*r, with %s and r in %s",
                command,
                commandUnit,
                k1,
                position,
                k2,
                position,
                feedforward,
                position,
                positionUnit);
        return new DesignResponse.PhysicalLaw(
                law,
                k1,
                commandUnit + "/" + positionUnit,
                k2,
                commandUnit + " s/" + positionUnit,
                kr,
                feedforward,
                commandUnit + "/" + positionUnit,
                "setpointFeedforward = a0/b = referenceGain - positionGain: " + meaning);
    }

    /** The caller-coordinate results the solver computed (pipeline.DesignPipeline#callerCoordinates). */
    private static DesignResponse.StateSpaceView stateSpace(StateSpaceDesign view) {
        DMatrixRMaj gain = view.gain();
        DMatrixRMaj output = view.trackedOutput();
        String law = String.format(
                Locale.US,
                "u = %.6g*r - (%.6g*x1 + %.6g*x2), tracking y = %.6g*x1 + (%.6g)*x2",
                view.referenceGain(),
                gain.get(0),
                gain.get(1),
                output.get(0),
                output.get(1));
        return new DesignResponse.StateSpaceView(
                "transform maps canonical to caller coordinates (x = T z);"
                        + " p, gain, stateWeight and trackedOutput are in the caller's coordinates x; the riccati and gain"
                        + " sections of the response are in the canonical coordinates z",
                rows(view.transform()),
                rows(view.p()),
                row(gain),
                rows(view.stateWeight()),
                row(output),
                view.referenceGain(),
                view.relativeResidual(),
                view.closedLoopPoles().stream()
                        .map(p -> new com.loopwright.api.result.Pole(p.re(), p.im()))
                        .toList(),
                law,
                view.controllabilityCondition(),
                view.loopLaw() == null ? null : loopLaw(view.loopLaw()));
    }

    /** The loop's law in the caller's coordinates, written out. */
    private static DesignResponse.LoopLawView loopLaw(CallerLoopLaw law) {
        DMatrixRMaj k = law.stateGain();
        DMatrixRMaj c = law.trackedOutput();
        DMatrixRMaj l = law.observerGain();
        String state = l == null ? "x" : "x_hat";
        StringBuilder text = new StringBuilder(String.format(Locale.US, "u = %.6g*r", law.referenceGain()));
        if (law.integralGain() != null) {
            text.append(String.format(Locale.US, " + %.6g*xi", law.integralGain()));
        }
        text.append(String.format(Locale.US, " - (%.6g*%s1 + (%.6g)*%s2)", k.get(0), state, k.get(1), state));
        if (law.integralGain() != null) {
            text.append(", xi' = r - y");
        }
        text.append(String.format(Locale.US, ", y = %.6g*x1 + (%.6g)*x2", c.get(0), c.get(1)));
        if (l != null) {
            text.append(String.format(
                    Locale.US,
                    ", x_hat' = A x_hat + B2 u + [%.6g, %.6g]' (y - (%.6g*x_hat1 + (%.6g)*x_hat2))",
                    l.get(0),
                    l.get(1),
                    c.get(0),
                    c.get(1)));
        }
        return new DesignResponse.LoopLawView(
                row(k), law.integralGain(), law.referenceGain(), l == null ? null : entries(l), text.toString());
    }

    private static List<List<Double>> rows(DMatrixRMaj m) {
        List<List<Double>> rows = new ArrayList<>();
        for (int i = 0; i < m.numRows; i++) {
            List<Double> row = new ArrayList<>();
            for (int j = 0; j < m.numCols; j++) {
                row.add(m.get(i, j));
            }
            rows.add(row);
        }
        return rows;
    }

    private static List<Double> row(DMatrixRMaj m) {
        return rows(m).get(0);
    }

    /** Every entry of a vector, row or column. */
    private static List<Double> entries(DMatrixRMaj m) {
        List<Double> entries = new ArrayList<>();
        for (int i = 0; i < m.getNumElements(); i++) {
            entries.add(m.get(i));
        }
        return entries;
    }
}
