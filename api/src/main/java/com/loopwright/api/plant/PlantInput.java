package com.loopwright.api.plant;

import com.fasterxml.jackson.databind.annotation.JsonDeserialize;
import com.fasterxml.jackson.databind.annotation.JsonSerialize;
import com.loopwright.api.problem.FieldError;
import java.util.List;

/**
 * The plant as sent by the caller, one record per description chosen by {@code form} (fields nullable until
 * validated); {@code form} is required. {@code "form": "canonical"} is {@link CanonicalPlantInput}, the
 * coefficients of x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w; the other forms are {@link RotaryAxisInput},
 * {@link MassSpringDamperInput}, {@link SecondOrderTransferFunctionInput} and {@link StateSpaceInput}. Each form
 * declares its fields once, as its record components ({@link PlantFormName} derives the field lists from them).
 * A plant object that makes no one form (no form, an unknown form name, fields of another form beside the chosen one's)
 * decodes to {@link UnmatchedPlant}, which validation reports with the request's other field errors.
 */
@JsonDeserialize(using = PlantInputDeserializer.class)
@JsonSerialize(using = PlantInputSerializer.class)
public sealed interface PlantInput
        permits CanonicalPlantInput,
                RotaryAxisInput,
                MassSpringDamperInput,
                SecondOrderTransferFunctionInput,
                StateSpaceInput,
                UnmatchedPlant {

    /**
     * Validates this description and converts it to the canonical coefficients. Adds 400-class errors (pointers
     * below /plant) to {@code errors} and returns null when it added any.
     *
     * @throws com.loopwright.solver.plant.PlantParameterException for a non-physical description (422)
     * @throws com.loopwright.solver.pipeline.SolverFailure PLANT_MODEL for a description the api refuses (422)
     */
    ResolvedPlant resolve(List<FieldError> errors);
}
