package com.loopwright.api.plant;

import static com.loopwright.api.validation.FieldLimits.MAX_ABS_A0;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_A1;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_B;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_D;
import static com.loopwright.api.validation.FieldLimits.MAX_ABS_PHYSICAL;
import static com.loopwright.api.validation.FieldLimits.MIN_ABS_B;

import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.Checks;
import com.loopwright.solver.pipeline.SolverFailure;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.PlantForm;
import com.loopwright.solver.plant.PlantParameterException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;

/** What the form records share: field checks with pointers below /plant, and the conversion to canonical. */
final class PlantConversion {

    private PlantConversion() {}

    /**
     * The converted canonical coefficients must be finite, keep b (and a given d) non-zero, and lie in the documented
     * canonical ranges. Each field is in its own range, but a ratio of two in-range fields need not be (1/J with
     * J = 4.9e-324 overflows); such a failure is reported at the field of the description farthest from 1 in
     * orders of magnitude, the one that drives the conversion out of range.
     *
     * @param fields the description's numeric fields by JSON pointer below /plant (e.g. "denominator/0")
     */
    static ResolvedPlant converted(
            PlantFormName form,
            PlantNotation notation,
            Supplier<PlantForm> description,
            Map<String, Double> fields,
            List<String> assumptions) {
        PlantForm source;
        CanonicalPlant plant;
        try {
            source = description.get();
            plant = source.canonical();
        } catch (PlantParameterException e) {
            String named = e.parameter();
            if (!named.isEmpty()
                    && fields.keySet().stream().anyMatch(f -> f.equals(named) || f.startsWith(named + "/"))) {
                throw e; // a field of this description, already named (a negative mass, an uncontrollable B2)
            }
            throw plantModel(
                    drivingField(fields),
                    e.getMessage() + "; rescale the units (for"
                            + " example mm instead of m, or g cm^2 instead of kg m^2)");
        }
        List<String> outside = new ArrayList<>();
        if (Math.abs(plant.a0()) > MAX_ABS_A0) {
            outside.add("a0");
        }
        if (Math.abs(plant.a1()) > MAX_ABS_A1) {
            outside.add("a1");
        }
        if (Math.abs(plant.b()) < MIN_ABS_B || Math.abs(plant.b()) > MAX_ABS_B) {
            outside.add("b");
        }
        if (Math.abs(plant.d()) > MAX_ABS_D) {
            outside.add("d");
        }
        if (!outside.isEmpty()) {
            throw plantModel(
                    drivingField(fields),
                    String.format(
                            "the derived canonical"
                                    + " coefficients (a0 = %.6g, a1 = %.6g, b = %.6g, d = %.6g) put %s outside the ranges the design"
                                    + " supports; rescale the units (for example mm instead of m, or g cm^2 instead of kg m^2)",
                            plant.a0(), plant.a1(), plant.b(), plant.d(), String.join(", ", outside)));
        }
        return new ResolvedPlant(form, plant, source, assumptions, notation);
    }

    /**
     * The refusal of a well-formed but unusable plant description at one of its fields (422 plant-model-unusable),
     * raised as the front door's own failure: the api constructs no solver exception.
     */
    static SolverFailure plantModel(String field, String reason) {
        return SolverFailure.about(SolverFailure.Kind.PLANT_MODEL, field, -1, reason, null);
    }

    /** The non-zero field farthest from 1 in orders of magnitude (|log10 |v||), or "" when there is none. */
    private static String drivingField(Map<String, Double> fields) {
        String driving = "";
        double farthest = -1;
        for (Map.Entry<String, Double> field : fields.entrySet()) {
            Double value = field.getValue();
            if (value == null || value == 0) {
                continue;
            }
            double decades = Math.abs(Math.log10(Math.abs(value)));
            if (decades > farthest) {
                farthest = decades;
                driving = field.getKey();
            }
        }
        return driving;
    }

    /** Named numeric fields in the order given (nulls kept out). */
    static Map<String, Double> fields(Object... nameValuePairs) {
        Map<String, Double> fields = new LinkedHashMap<>();
        for (int i = 0; i + 1 < nameValuePairs.length; i += 2) {
            if (nameValuePairs[i + 1] != null) {
                fields.put((String) nameValuePairs[i], (Double) nameValuePairs[i + 1]);
            }
        }
        return fields;
    }

    /** "name/0", "name/1", ... for each entry of a list. */
    static void putAll(Map<String, Double> fields, String name, List<Double> values) {
        for (int i = 0; i < values.size(); i++) {
            fields.put(name + "/" + i, values.get(i));
        }
    }

    /** A physical quantity of a description: present (if required), finite and of magnitude at most the cap. */
    static void physical(List<FieldError> errors, String name, Double value, boolean required) {
        Checks.magnitude(errors, "/plant/" + name, value, 0, MAX_ABS_PHYSICAL, required);
    }

    /** A list of exactly min..max finite numbers of magnitude at most MAX_ABS_PHYSICAL; null when invalid. */
    static List<Double> vector(List<FieldError> errors, String name, List<Double> values, int min, int max) {
        String pointer = "/plant/" + name;
        if (values == null) {
            errors.add(new FieldError(pointer, "required"));
            return null;
        }
        if (values.size() < min || values.size() > max) {
            errors.add(new FieldError(
                    pointer,
                    min == max
                            ? "must have exactly " + min + " numbers"
                            : "must have from " + min + " to " + max + " numbers"));
            return null;
        }
        int before = errors.size();
        for (int i = 0; i < values.size(); i++) {
            Checks.magnitude(errors, pointer + "/" + i, values.get(i), 0, MAX_ABS_PHYSICAL, true);
        }
        return errors.size() > before ? null : values;
    }
}
