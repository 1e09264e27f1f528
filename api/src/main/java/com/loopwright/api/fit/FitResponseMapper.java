package com.loopwright.api.fit;

import com.loopwright.api.design.Cautions;
import com.loopwright.api.plant.PlantFormName;
import com.loopwright.solver.plant.FitWarning;
import com.loopwright.solver.plant.FittedParameter;
import com.loopwright.solver.plant.StepFit;
import java.util.List;

/** A step-test fit to the wire record of POST /v1/models/fit. */
public final class FitResponseMapper {

    public FitResponse toResponse(ValidatedFit request, StepFit fit) {
        List<FitResponse.ParameterView> parameters =
                fit.parameters().stream().map(FitResponseMapper::view).toList();
        FitNotes notes = request.notes()
                .with(
                        FitNotes.FITTED_PLANT_FOR_DESIGN,
                        "plant is the fitted model as a secondOrderTransferFunction: pass it as the plant of POST"
                                + " /v1/designs. The disturbance is then assumed to enter at the plant input.");
        return new FitResponse(
                new FitResponse.FittedPlant(
                        PlantFormName.SECOND_ORDER_TRANSFER_FUNCTION.wireName(),
                        fit.gain(),
                        fit.naturalFrequency(),
                        fit.dampingRatio()),
                parameters,
                fit.deadTimeSeconds(),
                fit.initialOffset(),
                new FitResponse.StepView(
                        request.data().stepTimeSeconds(), request.data().stepAmplitude(), request.stepSource()),
                new FitResponse.Quality(
                        fit.rmsError(),
                        fit.rSquared(),
                        request.data().timeSeconds().length,
                        fit.degreesOfFreedom(),
                        fit.iterations(),
                        fit.evaluations()),
                fit.warnings().stream().map(FitResponseMapper::view).toList(),
                notes.texts(),
                notes.codes(),
                Cautions.ALL);
    }

    private static FitResponse.ParameterView view(FittedParameter p) {
        String unit = switch (p.name()) {
            case "gain" -> "output units per input unit";
            case "naturalFrequency" -> "rad/s";
            case "dampingRatio" -> "1";
            case "deadTime" -> "s";
            default -> "output units";
        };
        // A parameter the data do not determine has no standard error and no interval to report.
        return p.determined()
                ? new FitResponse.ParameterView(
                        p.name(), p.estimate(), p.standardError(), p.lower95(), p.upper95(), unit)
                : new FitResponse.ParameterView(p.name(), p.estimate(), null, null, null, unit);
    }

    private static FitResponse.WarningView view(FitWarning warning) {
        String code = warning.code().name().toLowerCase();
        StringBuilder camel = new StringBuilder();
        boolean upper = false;
        for (char c : code.toCharArray()) {
            if (c == '_') {
                upper = true;
            } else {
                camel.append(upper ? Character.toUpperCase(c) : c);
                upper = false;
            }
        }
        return new FitResponse.WarningView(camel.toString(), warning.message());
    }
}
