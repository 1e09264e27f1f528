package com.loopwright.api.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Each form decodes into its record and back; the problems of a plant object are worded as before. */
class PlantInputDecodingTest {

    private static final ObjectMapper STRICT = StrictJson.newMapper();

    record Body(PlantInput plant) {}

    @Test
    void everyFormRoundTripsThroughItsWireForm() throws Exception {
        List<PlantInput> forms = List.of(
                new CanonicalPlantInput(0.0, 0.48, 400.0, 400.0),
                new RotaryAxisInput(0.004, 0.002, 0.12, 5.0),
                new MassSpringDamperInput(2.5, 4.0, 150.0),
                new SecondOrderTransferFunctionInput(null, null, null, List.of(0.4), List.of(2.0, 1.8, 0.5), 0.2),
                new SecondOrderTransferFunctionInput(2.0, 10.0, 0.3, null, null, null),
                new StateSpaceInput(
                        List.of(List.of(0.0, 1.0), List.of(0.0, -2.0)), List.of(0.0, 150.0), List.of(0.0, 60.0)));
        for (PlantInput plant : forms) {
            String json = STRICT.writeValueAsString(plant);
            assertEquals(plant, STRICT.readValue(json, PlantInput.class), json);
            assertEquals(new Body(plant), STRICT.readValue("{\"plant\":" + json + "}", Body.class), json);
            JsonNode tree = STRICT.readTree(json);
            assertEquals(plant, STRICT.treeToValue(tree, PlantInput.class), json);
            PlantFormName form = PlantFormName.of(plant).orElseThrow();
            // every form is written with its form, the canonical one included (the form is required)
            assertEquals(form.wireName(), tree.path("form").textValue());
        }
    }

    // source: openapi.yaml, the request examples of POST /v1/designs (one per form)
    @Test
    void theContractExamplesDecodeIntoTheirRecords() throws Exception {
        assertEquals(
                new RotaryAxisInput(0.004, 0.002, 0.12, null),
                STRICT.readValue(
                        "{\"form\":\"rotaryAxis\","
                                + "\"inertia\":0.004,\"viscousFriction\":0.002,\"torqueConstant\":0.12}",
                        PlantInput.class));
        assertEquals(
                new MassSpringDamperInput(2.5, 4.0, 150.0),
                STRICT.readValue(
                        "{\"form\":\"massSpringDamper\"," + "\"mass\":2.5,\"damping\":4,\"stiffness\":150}",
                        PlantInput.class));
        assertEquals(
                new SecondOrderTransferFunctionInput(null, null, null, List.of(0.4), List.of(2.0, 1.8, 0.5), null),
                STRICT.readValue(
                        "{\"form\":\"secondOrderTransferFunction\",\"numerator\":[0.4],"
                                + "\"denominator\":[2,1.8,0.5]}",
                        PlantInput.class));
        assertEquals(
                new StateSpaceInput(
                        List.of(List.of(0.0, 1.0), List.of(0.0, -2.0)), List.of(0.0, 150.0), List.of(0.0, 60.0)),
                STRICT.readValue(
                        "{\"form\":\"stateSpace\",\"a\":[[0,1],[0,-2]]," + "\"b2\":[0,150],\"b1\":[0,60]}",
                        PlantInput.class));
        // "canonical" chooses the canonical coefficients; an absent or null form chooses none (a 400 at /plant/form)
        CanonicalPlantInput axis = new CanonicalPlantInput(0.0, 0.48, 400.0, 400.0);
        assertEquals(
                axis,
                STRICT.readValue(
                        "{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}", PlantInput.class));
        for (String form : List.of("", "\"form\":null,")) {
            assertEquals(
                    new UnmatchedPlant(null, List.of()),
                    STRICT.readValue("{" + form + "\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}", PlantInput.class),
                    form);
        }
    }

    // The messages below are the recorded answers of the golden corpus and of the former validator, verbatim.
    @Test
    void anUnknownFormIsOneFieldErrorListingTheForms() throws Exception {
        PlantInput plant = STRICT.readValue("{\"form\":\"linearMotor\",\"mass\":1}", PlantInput.class);
        assertEquals(new UnmatchedPlant("linearMotor", List.of()), plant);
        List<FieldError> errors = new ArrayList<>();
        assertNull(new PlantInputValidator().resolve(plant, errors));
        assertEquals(
                List.of(new FieldError(
                        "/plant/form",
                        "unknown form; one of [canonical, rotaryAxis,"
                                + " massSpringDamper, secondOrderTransferFunction, stateSpace]")),
                errors);
    }

    @Test
    void fieldsOfAnotherFormAreNamedInTheFormerOrder() throws Exception {
        PlantInput plant =
                STRICT.readValue("{\"mass\":1,\"form\":\"rotaryAxis\",\"inertia\":0.004,\"a0\":2}", PlantInput.class);
        List<FieldError> errors = new ArrayList<>();
        assertNull(new PlantInputValidator().resolve(plant, errors));
        String fields = " form (its fields: [gearRatio, inertia, torqueConstant, viscousFriction])";
        assertEquals(
                List.of(
                        new FieldError("/plant/a0", "not a field of the rotaryAxis" + fields),
                        new FieldError("/plant/mass", "not a field of the rotaryAxis" + fields)),
                errors);
        // the canonical form named, a physical field is not one of its fields
        List<FieldError> canonical = new ArrayList<>();
        assertNull(STRICT.readValue(
                        "{\"form\":\"canonical\",\"a0\":0,\"a1\":1,\"b\":1,\"d\":1,\"mass\":1}", PlantInput.class)
                .resolve(canonical));
        assertEquals(
                List.of(new FieldError(
                        "/plant/mass", "not a field of the canonical form (its fields: [a0, a1," + " b, d])")),
                canonical);
        // source: openapi.yaml PlantDescription (issue 15): the form is required; without it the answer is one error
        // at /plant/form naming every form, whatever the other fields are
        List<FieldError> unnamed = new ArrayList<>();
        assertNull(STRICT.readValue("{\"a0\":0,\"a1\":1,\"b\":1,\"d\":1}", PlantInput.class)
                .resolve(unnamed));
        assertEquals(
                List.of(new FieldError(
                        "/plant/form",
                        "required: the plant names its form, one of [canonical, rotaryAxis, massSpringDamper,"
                                + " secondOrderTransferFunction, stateSpace]")),
                unnamed);
        // a null field is absent, as before
        assertFalse(
                STRICT.readValue("{\"form\":\"massSpringDamper\",\"mass\":1,\"a0\":null}", PlantInput.class)
                        instanceof UnmatchedPlant);
    }

    @Test
    void decodingFailuresNameTheFieldAsBefore() {
        assertProblem(
                "{\"plant\":{\"form\":\"rotaryAxis\",\"length\":1,\"inertia\":\"x\"}}",
                "/plant/inertia",
                "wrong type: expected a JSON number");
        assertProblem("{\"plant\":{\"form\":\"rotaryAxis\",\"length\":1}}", "/plant/length", "unknown field 'length'");
        assertProblem(
                "{\"plant\":{\"form\":\"stateSpace\",\"a\":[[0,1],[0,\"x\"]]}}",
                "/plant/a/1/1",
                "wrong type: expected a JSON number");
        assertProblem(
                "{\"plant\":{\"form\":\"stateSpace\",\"b2\":3}}", "/plant/b2", "wrong type: expected a JSON array");
        assertProblem("{\"plant\":{\"form\":{}}}", "/plant/form", "wrong type: expected a JSON string");
        assertProblem("{\"plant\":[1,2]}", "/plant", "wrong type: expected a JSON object");
        // Parser failures inside the plant are named at their own member, with their cause (issue 15).
        assertProblem(
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a0\":1}}",
                "/plant/a0",
                "duplicate key: this member appears more than once in its object; send it once");
        assertProblem(
                "{\"plant\":{\"form\":\"canonical\",\"a0\":NaN}}",
                "/plant/a0",
                "NaN and Infinity are not JSON numbers; send a finite number");
    }

    @Test
    void anUnmatchedPlantIsNotWritten() {
        assertThrows(
                JsonProcessingException.class,
                () -> STRICT.writeValueAsString(new UnmatchedPlant("linearMotor", List.of())));
    }

    private static void assertProblem(String body, String pointer, String detail) {
        JsonProcessingException failure =
                assertThrows(JsonProcessingException.class, () -> STRICT.readValue(body, Body.class), body);
        Problem problem = DecodeFailures.toProblem(failure);
        assertEquals(400, problem.status(), body);
        assertEquals("field " + pointer + ": " + detail, problem.detail(), body);
        assertEquals(List.of(new FieldError(pointer, detail)), problem.errors(), body);
        assertTrue(problem.proposals().isEmpty(), body);
    }
}
