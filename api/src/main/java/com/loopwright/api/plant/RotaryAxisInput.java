package com.loopwright.api.plant;

import static com.loopwright.api.plant.PlantConversion.physical;

import com.fasterxml.jackson.databind.JsonDeserializer;
import com.fasterxml.jackson.databind.annotation.JsonDeserialize;
import com.loopwright.api.problem.FieldError;
import com.loopwright.solver.plant.RotaryAxis;
import java.util.ArrayList;
import java.util.List;

/**
 * The {@code rotaryAxis} form: J q'' + c q' = N kt i + w at the load.
 *
 * @param inertia         total inertia reflected to the load J [kg m^2]
 * @param viscousFriction viscous friction c [N m s/rad]
 * @param torqueConstant  motor torque constant kt [N m/A]
 * @param gearRatio       motor turns per load turn N; optional, default 1 (direct drive)
 */
@JsonDeserialize(using = JsonDeserializer.None.class)
public record RotaryAxisInput(Double inertia, Double viscousFriction, Double torqueConstant, Double gearRatio)
        implements PlantInput {

    /** The load angle q [rad] and the current command i [A]. */
    static final PlantNotation NOTATION = new PlantNotation(
            "rad",
            "rad/s",
            "A",
            "N m",
            "rad",
            new PlantNotation.LawTerms(
                    "i",
                    "A",
                    "q",
                    "rad",
                    "no holding current is needed at standstill: the axis" + " has no stiffness (a0 = 0)"));

    @Override
    public ResolvedPlant resolve(List<FieldError> errors) {
        int before = errors.size();
        physical(errors, "inertia", inertia, true);
        physical(errors, "viscousFriction", viscousFriction, true);
        physical(errors, "torqueConstant", torqueConstant, true);
        physical(errors, "gearRatio", gearRatio, false);
        if (errors.size() > before) {
            return null;
        }
        double ratio = gearRatio == null ? 1 : gearRatio;
        List<String> assumptions = new ArrayList<>();
        assumptions.add("J q'' + c q' = N kt i + w at the load: q [rad] is the load angle, i [A] the current"
                + " command, w [N m] a load torque; inertia is the total inertia reflected to the load side.");
        if (gearRatio == null) {
            assumptions.add("No gearRatio given: direct drive (N = 1).");
        }
        return PlantConversion.converted(
                PlantFormName.ROTARY_AXIS,
                NOTATION,
                () -> new RotaryAxis(inertia, viscousFriction, torqueConstant, ratio),
                PlantConversion.fields(
                        "inertia",
                        inertia,
                        "viscousFriction",
                        viscousFriction,
                        "torqueConstant",
                        torqueConstant,
                        "gearRatio",
                        gearRatio),
                assumptions);
    }
}
