package com.loopwright.api.plant;

import com.loopwright.api.problem.FieldError;
import java.util.List;

/**
 * Checks the plant object of a design request and converts its description to the canonical coefficients.
 * Shape, presence and range problems are collected as 400 field errors; a well-formed description that is not
 * physical (a negative mass, an uncontrollable model) raises
 * {@link com.loopwright.solver.plant.PlantParameterException} (a 422); one the api refuses itself (out of the
 * canonical ranges, a transfer function with a zero) raises the front door's SolverFailure PLANT_MODEL, the same
 * 422. Each form record checks its own fields
 * ({@link PlantInput#resolve}); an object that makes no one form is an {@link UnmatchedPlant}.
 */
public final class PlantInputValidator {

    /**
     * Validates and converts. Adds 400-class errors to {@code errors} and returns null when there are any.
     *
     * @throws com.loopwright.solver.plant.PlantParameterException for a non-physical description
     * @throws com.loopwright.solver.pipeline.SolverFailure PLANT_MODEL for a description the api refuses
     */
    public ResolvedPlant resolve(PlantInput plant, List<FieldError> errors) {
        return plant.resolve(errors);
    }
}
