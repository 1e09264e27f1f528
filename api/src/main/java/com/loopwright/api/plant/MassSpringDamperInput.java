package com.loopwright.api.plant;

import static com.loopwright.api.plant.PlantConversion.physical;

import com.fasterxml.jackson.databind.JsonDeserializer;
import com.fasterxml.jackson.databind.annotation.JsonDeserialize;
import com.loopwright.api.problem.FieldError;
import com.loopwright.solver.plant.MassSpringDamper;
import java.util.List;

/**
 * The {@code massSpringDamper} form: m y'' + c y' + k y = F + w.
 *
 * @param mass      moving mass m [kg]
 * @param damping   viscous damping c [N s/m]
 * @param stiffness spring stiffness k [N/m]
 */
@JsonDeserialize(using = JsonDeserializer.None.class)
public record MassSpringDamperInput(Double mass, Double damping, Double stiffness) implements PlantInput {

    /** The position y [m] and the force command F [N]. */
    static final PlantNotation NOTATION = new PlantNotation(
            "m",
            "m/s",
            "N",
            "N",
            "m",
            new PlantNotation.LawTerms(
                    "F", "N", "y", "m", "the spring force k r that holds the mass at the" + " setpoint"));

    @Override
    public ResolvedPlant resolve(List<FieldError> errors) {
        int before = errors.size();
        physical(errors, "mass", mass, true);
        physical(errors, "damping", damping, true);
        physical(errors, "stiffness", stiffness, true);
        if (errors.size() > before) {
            return null;
        }
        return PlantConversion.converted(
                PlantFormName.MASS_SPRING_DAMPER,
                NOTATION,
                () -> new MassSpringDamper(mass, damping, stiffness),
                PlantConversion.fields("mass", mass, "damping", damping, "stiffness", stiffness),
                List.of("m y'' + c y' + k y = F + w: y [m] is the position, F [N] the force command, w [N] a"
                        + " disturbance force acting where the actuator acts."));
    }
}
