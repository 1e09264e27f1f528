package com.loopwright.api.plant;

import static com.loopwright.api.request.FieldLimits.*;

import com.loopwright.api.problem.FieldError;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.MassSpringDamper;
import com.loopwright.solver.plant.PlantForm;
import com.loopwright.solver.plant.PlantParameterException;
import com.loopwright.solver.plant.RotaryAxis;
import com.loopwright.solver.plant.SecondOrderTransferFunction;
import com.loopwright.solver.plant.TwoStateModel;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;

/**
 * Checks the plant object of a design request and converts its description to the canonical coefficients.
 * Shape, presence and range problems are collected as 400 field errors; a well-formed description that is not
 * physical (a negative mass, an uncontrollable model) raises {@link PlantParameterException} (a 422).
 */
public final class PlantInputValidator {

    /**
     * Validates and converts. Adds 400-class errors to {@code errors} and returns null when there are any.
     *
     * @throws PlantParameterException for a non-physical or unusable description
     */
    public ResolvedPlant resolve(PlantInput plant, List<FieldError> errors) {
        int before = errors.size();
        PlantFormName form = PlantFormName.CANONICAL;
        if (plant.form() != null) {
            var named = PlantFormName.ofWireName(plant.form());
            if (named.isEmpty()) {
                errors.add(new FieldError("/plant/form", "unknown form; one of " + PlantFormName.wireNames()));
                return null;
            }
            form = named.get();
        }
        for (Map.Entry<String, Object> field : present(plant).entrySet()) {
            if (!form.fields().contains(field.getKey())) {
                errors.add(new FieldError("/plant/" + field.getKey(), "not a field of the " + form.wireName()
                        + " form (its fields: " + new java.util.TreeSet<>(form.fields()) + ")"));
            }
        }
        if (errors.size() > before) {
            return null;
        }
        return switch (form) {
            case CANONICAL -> canonical(plant, errors, before);
            case ROTARY_AXIS -> rotaryAxis(plant, errors, before);
            case MASS_SPRING_DAMPER -> massSpringDamper(plant, errors, before);
            case SECOND_ORDER_TRANSFER_FUNCTION -> transferFunction(plant, errors, before);
            case STATE_SPACE -> stateSpace(plant, errors, before);
        };
    }

    private static ResolvedPlant canonical(PlantInput plant, List<FieldError> errors, int before) {
        PlantFieldChecks.magnitude(errors, "/plant/a0", plant.a0(), 0, MAX_ABS_A0, true);
        PlantFieldChecks.magnitude(errors, "/plant/a1", plant.a1(), 0, MAX_ABS_A1, true);
        PlantFieldChecks.magnitude(errors, "/plant/b", plant.b(), MIN_ABS_B, MAX_ABS_B, true);
        PlantFieldChecks.magnitude(errors, "/plant/d", plant.d(), 0, MAX_ABS_D, true);
        if (errors.size() > before) {
            return null;
        }
        return ResolvedPlant.canonical(new CanonicalPlant(plant.a0(), plant.a1(), plant.b(), plant.d()));
    }

    private static ResolvedPlant rotaryAxis(PlantInput plant, List<FieldError> errors, int before) {
        physical(errors, "inertia", plant.inertia(), true);
        physical(errors, "viscousFriction", plant.viscousFriction(), true);
        physical(errors, "torqueConstant", plant.torqueConstant(), true);
        physical(errors, "gearRatio", plant.gearRatio(), false);
        if (errors.size() > before) {
            return null;
        }
        double gearRatio = plant.gearRatio() == null ? 1 : plant.gearRatio();
        List<String> assumptions = new ArrayList<>();
        assumptions.add("J q'' + c q' = N kt i + w at the load: q [rad] is the load angle, i [A] the current"
                + " command, w [N m] a load torque; inertia is the total inertia reflected to the load side.");
        if (plant.gearRatio() == null) {
            assumptions.add("No gearRatio given: direct drive (N = 1).");
        }
        return converted(PlantFormName.ROTARY_AXIS, () -> new RotaryAxis(plant.inertia(), plant.viscousFriction(),
                plant.torqueConstant(), gearRatio), fields("inertia", plant.inertia(), "viscousFriction",
                plant.viscousFriction(), "torqueConstant", plant.torqueConstant(), "gearRatio", plant.gearRatio()),
                assumptions);
    }

    private static ResolvedPlant massSpringDamper(PlantInput plant, List<FieldError> errors, int before) {
        physical(errors, "mass", plant.mass(), true);
        physical(errors, "damping", plant.damping(), true);
        physical(errors, "stiffness", plant.stiffness(), true);
        if (errors.size() > before) {
            return null;
        }
        return converted(PlantFormName.MASS_SPRING_DAMPER, () -> new MassSpringDamper(plant.mass(), plant.damping(),
                plant.stiffness()), fields("mass", plant.mass(), "damping", plant.damping(), "stiffness",
                plant.stiffness()), List.of("m y'' + c y' + k y = F + w: y [m] is the position, F [N] the force"
                + " command, w [N] a disturbance force acting where the actuator acts."));
    }

    private static ResolvedPlant transferFunction(PlantInput plant, List<FieldError> errors, int before) {
        boolean gainForm = plant.gain() != null || plant.naturalFrequency() != null || plant.dampingRatio() != null;
        boolean coefficientForm = plant.numerator() != null || plant.denominator() != null;
        if (gainForm && coefficientForm) {
            errors.add(new FieldError("/plant/numerator", "give either gain, naturalFrequency and dampingRatio,"
                    + " or numerator and denominator, not both"));
            return null;
        }
        physical(errors, "disturbanceNumerator", plant.disturbanceNumerator(), false);
        List<String> assumptions = new ArrayList<>();
        assumptions.add("Phase-variable realization: x1 = y (the output), x2 = y'; the command u is the"
                + " transfer function's input.");
        if (plant.disturbanceNumerator() == null) {
            assumptions.add("No disturbanceNumerator given: the disturbance is assumed to enter at the plant"
                    + " input, in command units (same numerator as the command path).");
        }
        if (!coefficientForm) {
            physical(errors, "gain", plant.gain(), true);
            physical(errors, "naturalFrequency", plant.naturalFrequency(), true);
            physical(errors, "dampingRatio", plant.dampingRatio(), true);
            if (errors.size() > before) {
                return null;
            }
            double numerator = plant.gain() * plant.naturalFrequency() * plant.naturalFrequency();
            return converted(PlantFormName.SECOND_ORDER_TRANSFER_FUNCTION,
                    () -> SecondOrderTransferFunction.ofGainFrequencyDamping(plant.gain(), plant.naturalFrequency(),
                            plant.dampingRatio(), plant.disturbanceNumerator() == null ? numerator
                                    : plant.disturbanceNumerator()), fields("gain", plant.gain(), "naturalFrequency",
                            plant.naturalFrequency(), "dampingRatio", plant.dampingRatio(), "disturbanceNumerator",
                            plant.disturbanceNumerator()), assumptions);
        }
        List<Double> numerator = vector(errors, "numerator", plant.numerator(), 1, MAX_NUMERATOR_COEFFICIENTS);
        List<Double> denominator = vector(errors, "denominator", plant.denominator(), 3, 3);
        if (errors.size() > before) {
            return null;
        }
        int first = 0;
        while (first < numerator.size() - 1 && numerator.get(first) == 0) {
            first++;
        }
        if (numerator.size() - first > 1) {
            throw new PlantParameterException("numerator", "the numerator has a zero (it is not a constant);"
                    + " the canonical second-order form has no zeros, so this transfer function cannot be used");
        }
        double n = numerator.get(first);
        Map<String, Double> fields = new LinkedHashMap<>();
        fields.put("numerator/" + first, n);
        putAll(fields, "denominator", denominator);
        if (plant.disturbanceNumerator() != null) {
            fields.put("disturbanceNumerator", plant.disturbanceNumerator());
        }
        return converted(PlantFormName.SECOND_ORDER_TRANSFER_FUNCTION, () -> new SecondOrderTransferFunction(n,
                plant.disturbanceNumerator() == null ? n : plant.disturbanceNumerator(), denominator.get(0),
                denominator.get(1), denominator.get(2)), fields, assumptions);
    }

    private static ResolvedPlant stateSpace(PlantInput plant, List<FieldError> errors, int before) {
        double[][] a = new double[2][];
        if (plant.a() == null) {
            errors.add(new FieldError("/plant/a", "required"));
        } else if (plant.a().size() != 2) {
            errors.add(new FieldError("/plant/a", "must be 2 rows of 2 numbers"));
        } else {
            for (int i = 0; i < 2; i++) {
                List<Double> row = vector(errors, "a/" + i, plant.a().get(i), 2, 2);
                a[i] = row == null ? null : new double[] {row.get(0), row.get(1)};
            }
        }
        List<Double> b2 = vector(errors, "b2", plant.b2(), 2, 2);
        List<Double> b1 = plant.b1() == null ? List.of(0.0, 0.0) : vector(errors, "b1", plant.b1(), 2, 2);
        if (errors.size() > before) {
            return null;
        }
        List<String> assumptions = new ArrayList<>();
        assumptions.add("x' = A x + B2 u + B1 w with both states measured; the design is made in canonical"
                + " coordinates z = T^-1 x and returned in yours (see model.stateSpace).");
        if (plant.b1() == null) {
            assumptions.add("No b1 given: the model has no disturbance channel (gamma is free).");
        }
        Map<String, Double> fields = new LinkedHashMap<>();
        putAll(fields, "a/0", List.of(a[0][0], a[0][1]));
        putAll(fields, "a/1", List.of(a[1][0], a[1][1]));
        putAll(fields, "b2", b2);
        putAll(fields, "b1", b1);
        return converted(PlantFormName.STATE_SPACE, () -> new TwoStateModel(a, new double[] {b2.get(0), b2.get(1)},
                new double[] {b1.get(0), b1.get(1)}), fields, assumptions);
    }

    /**
     * The converted canonical coefficients must be finite, keep b (and a given d) non-zero, and lie in the documented
     * canonical ranges. Each field is in its own range, but a ratio of two in-range fields need not be (1/J with
     * J = 4.9e-324 overflows); such a failure is reported at the field of the description farthest from 1 in
     * orders of magnitude, the one that drives the conversion out of range.
     *
     * @param fields the description's numeric fields by JSON pointer below /plant (e.g. "denominator/0")
     */
    private static ResolvedPlant converted(PlantFormName form, Supplier<PlantForm> description,
                                           Map<String, Double> fields, List<String> assumptions) {
        PlantForm source;
        CanonicalPlant plant;
        try {
            source = description.get();
            plant = source.canonical();
        } catch (PlantParameterException e) {
            String named = e.parameter();
            if (!named.isEmpty() && fields.keySet().stream().anyMatch(f -> f.equals(named)
                    || f.startsWith(named + "/"))) {
                throw e; // a field of this description, already named (a negative mass, an uncontrollable B2)
            }
            throw new PlantParameterException(drivingField(fields), e.getMessage() + "; rescale the units (for"
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
            throw new PlantParameterException(drivingField(fields), String.format("the derived canonical"
                    + " coefficients (a0 = %.6g, a1 = %.6g, b = %.6g, d = %.6g) put %s outside the ranges the design"
                    + " supports; rescale the units (for example mm instead of m, or g cm^2 instead of kg m^2)",
                    plant.a0(), plant.a1(), plant.b(), plant.d(), String.join(", ", outside)));
        }
        return new ResolvedPlant(form, plant, source, assumptions);
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
    private static Map<String, Double> fields(Object... nameValuePairs) {
        Map<String, Double> fields = new LinkedHashMap<>();
        for (int i = 0; i + 1 < nameValuePairs.length; i += 2) {
            if (nameValuePairs[i + 1] != null) {
                fields.put((String) nameValuePairs[i], (Double) nameValuePairs[i + 1]);
            }
        }
        return fields;
    }

    /** "name/0", "name/1", ... for each entry of a list. */
    private static void putAll(Map<String, Double> fields, String name, List<Double> values) {
        for (int i = 0; i < values.size(); i++) {
            fields.put(name + "/" + i, values.get(i));
        }
    }

    private static void physical(List<FieldError> errors, String name, Double value, boolean required) {
        PlantFieldChecks.magnitude(errors, "/plant/" + name, value, 0, MAX_ABS_PHYSICAL, required);
    }

    /** A list of exactly min..max finite numbers of magnitude at most MAX_ABS_STATE_SPACE; null when invalid. */
    private static List<Double> vector(List<FieldError> errors, String name, List<Double> values, int min,
                                       int max) {
        String pointer = "/plant/" + name;
        if (values == null) {
            errors.add(new FieldError(pointer, "required"));
            return null;
        }
        if (values.size() < min || values.size() > max) {
            errors.add(new FieldError(pointer, min == max ? "must have exactly " + min + " numbers"
                    : "must have from " + min + " to " + max + " numbers"));
            return null;
        }
        int before = errors.size();
        for (int i = 0; i < values.size(); i++) {
            PlantFieldChecks.magnitude(errors, pointer + "/" + i, values.get(i), 0, MAX_ABS_PHYSICAL, true);
        }
        return errors.size() > before ? null : values;
    }

    private static Map<String, Object> present(PlantInput plant) {
        Map<String, Object> fields = new LinkedHashMap<>();
        put(fields, "a0", plant.a0());
        put(fields, "a1", plant.a1());
        put(fields, "b", plant.b());
        put(fields, "d", plant.d());
        put(fields, "inertia", plant.inertia());
        put(fields, "viscousFriction", plant.viscousFriction());
        put(fields, "torqueConstant", plant.torqueConstant());
        put(fields, "gearRatio", plant.gearRatio());
        put(fields, "mass", plant.mass());
        put(fields, "damping", plant.damping());
        put(fields, "stiffness", plant.stiffness());
        put(fields, "gain", plant.gain());
        put(fields, "naturalFrequency", plant.naturalFrequency());
        put(fields, "dampingRatio", plant.dampingRatio());
        put(fields, "numerator", plant.numerator());
        put(fields, "denominator", plant.denominator());
        put(fields, "disturbanceNumerator", plant.disturbanceNumerator());
        put(fields, "a", plant.a());
        put(fields, "b2", plant.b2());
        put(fields, "b1", plant.b1());
        return fields;
    }

    private static void put(Map<String, Object> fields, String name, Object value) {
        if (value != null) {
            fields.put(name, value);
        }
    }
}
