package com.loopwright.api.plant;

import static com.loopwright.api.plant.PlantConversion.physical;
import static com.loopwright.api.plant.PlantConversion.vector;
import static com.loopwright.api.validation.FieldLimits.MAX_NUMERATOR_COEFFICIENTS;

import com.fasterxml.jackson.databind.JsonDeserializer;
import com.fasterxml.jackson.databind.annotation.JsonDeserialize;
import com.loopwright.api.problem.FieldError;
import com.loopwright.solver.plant.SecondOrderTransferFunction;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The {@code secondOrderTransferFunction} form: Y(s) = (n U(s) + m W(s))/(c2 s^2 + c1 s + c0), given either as
 * gain, naturalFrequency and dampingRatio or as numerator and denominator (not both).
 *
 * @param gain                 steady-state gain K [output per input unit]
 * @param naturalFrequency     natural frequency wn [rad/s]
 * @param dampingRatio         damping ratio zeta
 * @param numerator            numerator coefficients, highest power of s first
 * @param denominator          [c2, c1, c0], highest power first
 * @param disturbanceNumerator m, numerator of the disturbance path; optional, default the command numerator
 */
@JsonDeserialize(using = JsonDeserializer.None.class)
public record SecondOrderTransferFunctionInput(
        Double gain,
        Double naturalFrequency,
        Double dampingRatio,
        List<Double> numerator,
        List<Double> denominator,
        Double disturbanceNumerator)
        implements PlantInput {

    /** Phase variables: the output y and its rate. */
    static final PlantNotation NOTATION =
            new PlantNotation("y (output units)", "y units/s", "input units", "disturbance units", "y units", null);

    @Override
    public ResolvedPlant resolve(List<FieldError> errors) {
        int before = errors.size();
        boolean gainForm = gain != null || naturalFrequency != null || dampingRatio != null;
        boolean coefficientForm = numerator != null || denominator != null;
        if (gainForm && coefficientForm) {
            errors.add(new FieldError(
                    "/plant/numerator",
                    "give either gain, naturalFrequency and dampingRatio,"
                            + " or numerator and denominator, not both"));
            return null;
        }
        physical(errors, "disturbanceNumerator", disturbanceNumerator, false);
        List<String> assumptions = new ArrayList<>();
        assumptions.add("Phase-variable realization: x1 = y (the output), x2 = y'; the command u is the"
                + " transfer function's input.");
        if (disturbanceNumerator == null) {
            assumptions.add("No disturbanceNumerator given: the disturbance is assumed to enter at the plant"
                    + " input, in command units (same numerator as the command path).");
        }
        if (!coefficientForm) {
            physical(errors, "gain", gain, true);
            physical(errors, "naturalFrequency", naturalFrequency, true);
            physical(errors, "dampingRatio", dampingRatio, true);
            if (errors.size() > before) {
                return null;
            }
            double commandNumerator = gain * naturalFrequency * naturalFrequency;
            return PlantConversion.converted(
                    PlantFormName.SECOND_ORDER_TRANSFER_FUNCTION,
                    NOTATION,
                    () -> SecondOrderTransferFunction.ofGainFrequencyDamping(
                            gain,
                            naturalFrequency,
                            dampingRatio,
                            disturbanceNumerator == null ? commandNumerator : disturbanceNumerator),
                    PlantConversion.fields(
                            "gain",
                            gain,
                            "naturalFrequency",
                            naturalFrequency,
                            "dampingRatio",
                            dampingRatio,
                            "disturbanceNumerator",
                            disturbanceNumerator),
                    assumptions);
        }
        List<Double> checkedNumerator = vector(errors, "numerator", numerator, 1, MAX_NUMERATOR_COEFFICIENTS);
        List<Double> checkedDenominator = vector(errors, "denominator", denominator, 3, 3);
        if (errors.size() > before) {
            return null;
        }
        int first = 0;
        while (first < checkedNumerator.size() - 1 && checkedNumerator.get(first) == 0) {
            first++;
        }
        if (checkedNumerator.size() - first > 1) {
            throw PlantConversion.plantModel(
                    "numerator",
                    "the numerator has a zero (it is not a constant);"
                            + " the canonical second-order form has no zeros, so this transfer function cannot be used");
        }
        double n = checkedNumerator.get(first);
        Map<String, Double> fields = new LinkedHashMap<>();
        fields.put("numerator/" + first, n);
        PlantConversion.putAll(fields, "denominator", checkedDenominator);
        if (disturbanceNumerator != null) {
            fields.put("disturbanceNumerator", disturbanceNumerator);
        }
        return PlantConversion.converted(
                PlantFormName.SECOND_ORDER_TRANSFER_FUNCTION,
                NOTATION,
                () -> new SecondOrderTransferFunction(
                        n,
                        disturbanceNumerator == null ? n : disturbanceNumerator,
                        checkedDenominator.get(0),
                        checkedDenominator.get(1),
                        checkedDenominator.get(2)),
                fields,
                assumptions);
    }
}
