package com.loopwright.api.plant;

import static com.loopwright.api.plant.PlantConversion.vector;

import com.fasterxml.jackson.databind.JsonDeserializer;
import com.fasterxml.jackson.databind.annotation.JsonDeserialize;
import com.loopwright.api.problem.FieldError;
import com.loopwright.solver.pipeline.DesignPipeline;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The {@code stateSpace} form: x' = A x + B2 u + B1 w with both states measured, in the caller's coordinates.
 *
 * @param a  A as 2 rows of 2 numbers
 * @param b2 actuator input B2
 * @param b1 disturbance input B1; optional, default [0, 0] (no disturbance channel)
 */
@JsonDeserialize(using = JsonDeserializer.None.class)
public record StateSpaceInput(List<List<Double>> a, List<Double> b2, List<Double> b1) implements PlantInput {

    /** The canonical coordinates z = T^-1 x: the tracked output and its rate. */
    static final PlantNotation NOTATION =
            new PlantNotation("z1 = y = c x (the tracked output)", "z2 = y'", "u units", "w units", "y units", null);

    /** A is 2 x 2: the form describes a plant of two states. */
    private static final int STATES = 2;

    @Override
    public ResolvedPlant resolve(List<FieldError> errors) {
        int before = errors.size();
        double[][] matrix = new double[STATES][];
        if (a == null) {
            errors.add(new FieldError("/plant/a", "required"));
        } else if (a.size() != STATES) {
            errors.add(new FieldError("/plant/a", "must be 2 rows of 2 numbers"));
        } else {
            for (int i = 0; i < STATES; i++) {
                List<Double> row = vector(errors, "a/" + i, a.get(i), STATES, STATES);
                matrix[i] = row == null ? null : new double[] {row.get(0), row.get(1)};
            }
        }
        List<Double> actuator = vector(errors, "b2", b2, STATES, STATES);
        List<Double> disturbance = b1 == null ? List.of(0.0, 0.0) : vector(errors, "b1", b1, STATES, STATES);
        if (errors.size() > before) {
            return null;
        }
        List<String> assumptions = new ArrayList<>();
        assumptions.add("x' = A x + B2 u + B1 w with both states measured; the design is made in canonical"
                + " coordinates z = T^-1 x and returned in yours (see model.stateSpace).");
        if (b1 == null) {
            assumptions.add("No b1 given: the model has no disturbance channel (gamma is free).");
        }
        Map<String, Double> fields = new LinkedHashMap<>();
        PlantConversion.putAll(fields, "a/0", List.of(matrix[0][0], matrix[0][1]));
        PlantConversion.putAll(fields, "a/1", List.of(matrix[1][0], matrix[1][1]));
        PlantConversion.putAll(fields, "b2", actuator);
        PlantConversion.putAll(fields, "b1", disturbance);
        return PlantConversion.converted(
                PlantFormName.STATE_SPACE,
                NOTATION,
                () -> DesignPipeline.stateSpacePlant(
                        matrix,
                        new double[] {actuator.get(0), actuator.get(1)},
                        new double[] {disturbance.get(0), disturbance.get(1)}),
                fields,
                assumptions);
    }
}
