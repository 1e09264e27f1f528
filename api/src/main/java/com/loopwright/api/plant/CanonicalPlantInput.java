package com.loopwright.api.plant;

import static com.loopwright.api.validation.FieldLimits.MAX_ABS_A0;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_A1;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_B;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_D;
import static com.loopwright.api.validation.FieldLimits.MIN_ABS_B;

import com.fasterxml.jackson.databind.JsonDeserializer;
import com.fasterxml.jackson.databind.annotation.JsonDeserialize;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.Checks;
import com.loopwright.solver.plant.CanonicalPlant;
import java.util.List;

/**
 * Canonical plant coefficients of x1' = x2, x2' = -a0 x1 - a1 x2 + b u + d w: the plant {@code "form":
 * "canonical"}. Named directly as a field type it decodes as a plain record, where "form" is an unknown field
 * (POST /v1/verifications reads its plant as api.verification.VerificationPlantInput, which names the form).
 */
@JsonDeserialize(using = JsonDeserializer.None.class)
public record CanonicalPlantInput(Double a0, Double a1, Double b, Double d) implements PlantInput {

    /** The canonical states in the caller's own units. */
    static final PlantNotation NOTATION =
            new PlantNotation("x1 units", "x1 units/s", "u units", "w units", "x1 units", null);

    @Override
    public ResolvedPlant resolve(List<FieldError> errors) {
        int before = errors.size();
        Checks.magnitude(errors, "/plant/a0", a0, 0, MAX_ABS_A0, true);
        Checks.magnitude(errors, "/plant/a1", a1, 0, MAX_ABS_A1, true);
        Checks.magnitude(errors, "/plant/b", b, MIN_ABS_B, MAX_ABS_B, true);
        Checks.magnitude(errors, "/plant/d", d, 0, MAX_ABS_D, true);
        if (errors.size() > before) {
            return null;
        }
        return ResolvedPlant.canonical(new CanonicalPlant(a0, a1, b, d));
    }
}
