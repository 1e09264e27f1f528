package com.loopwright.api.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Plant descriptions whose every field is inside its documented range but whose conversion to the canonical
 * coefficients overflows or underflows double precision (a0 = c0/c2, b = N kt/J, ... from the forms' equations of
 * motion) are 422 plant-model-unusable problems that point at the field driving the conversion, never a 500.
 */
class PlantConversionRangeTest {

    private static final String SPEC = "\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":1}";

    // The reproductions of the issue: 4.9e-324 is the smallest subnormal double, 1/4.9e-324 overflows to Infinity
    // and 1 * 4.9e-324 / 1 stays below the canonical b range; 0.5/1e-320 and 1e12/1e-300 overflow.
    @ParameterizedTest
    @CsvSource(
            delimiter = '|',
            value = {
                "{\"form\":\"rotaryAxis\",\"inertia\":4.9e-324,\"viscousFriction\":0,\"torqueConstant\":1} | /plant/inertia",
                "{\"form\":\"massSpringDamper\",\"mass\":4.9e-324,\"damping\":4,\"stiffness\":150} | /plant/mass",
                "{\"form\":\"rotaryAxis\",\"inertia\":1,\"viscousFriction\":0,\"torqueConstant\":1,\"gearRatio\":4.9e-324}"
                        + " | /plant/gearRatio",
                "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[1],\"denominator\":[1e-320,1.8,0.5]}"
                        + " | /plant/denominator/0",
                "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[4.9e-324],\"denominator\":[1,1.8,0.5]}"
                        + " | /plant/numerator/0",
                "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[1e12],\"denominator\":[1e-300,1,1]}"
                        + " | /plant/denominator/0",
                // Further cases of the same kind: K wn^2 overflows in the gain form; a subnormal B2 entry in state
                // space.
                "{\"form\":\"secondOrderTransferFunction\",\"gain\":1e12,\"naturalFrequency\":1e12,\"dampingRatio\":0.5}"
                        + " | /plant/gain",
                "{\"form\":\"stateSpace\",\"a\":[[0,1],[0,-2]],\"b2\":[0,1e-160]} | /plant/b2/1",
            })
    void conversionOutsideDoublePrecisionIsA422AtTheField(String plant, String pointer) {
        Answer outcome = Answer.design(("{\"plant\":" + plant + "," + SPEC + "}").getBytes(StandardCharsets.UTF_8));
        assertEquals(422, outcome.status(), () -> outcome.body().toString());
        assertEquals(
                "tag:loopwright.dev,2026:problem/plant-model-unusable",
                outcome.body().get("type").asText());
        assertEquals(
                pointer,
                outcome.body().at("/errors/0/pointer").asText(),
                () -> outcome.body().toString());
        assertTrue(
                outcome.body().get("detail").asText().contains("canonical"),
                () -> outcome.body().toString());
    }
}
