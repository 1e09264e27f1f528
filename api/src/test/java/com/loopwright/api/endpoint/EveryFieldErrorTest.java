package com.loopwright.api.endpoint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Every field error in one answer: an unknown member or a value of the wrong type no longer hides the bad values
 * elsewhere in the body. Each case is the exact body of the report (issue 15) or a nested variant of it; the
 * problem is one 400 malformed-request listing the decoding errors (in document order) and then the validation
 * errors of the rest, each at its pointer.
 */
class EveryFieldErrorTest {

    private static final ObjectMapper STRICT = StrictJson.newMapper();
    private static final String PLANT = "{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}";
    private static final String SPEC = "{\"settlingTime\":0.15,\"overshootPercent\":1.5}";
    private static final String SETTLING_RANGE = "must be a finite number from 1.0E-4 to 10000";

    @Test
    void anUnknownMemberAndAnOutOfRangeValueAreBothNamed() {
        // Before: only {"pointer":"/foo","detail":"unknown field 'foo'"}; the negative settling time went unnamed.
        String body = "{\"plant\":" + PLANT + ",\"spec\":{\"settlingTime\":-1,\"overshootPercent\":1.5},\"foo\":1}";
        Problem problem = design(body);
        assertEquals(400, problem.status());
        assertEquals(ProblemType.MALFORMED_REQUEST.uri(), problem.type());
        assertEquals("2 fields are invalid; see errors", problem.detail());
        assertEquals(
                List.of(
                        new FieldError("/foo", "unknown field 'foo'"),
                        new FieldError("/spec/settlingTime", SETTLING_RANGE)),
                problem.errors());
    }

    @Test
    void unknownMembersAndWrongTypesAtEveryDepthAreAllNamed() {
        String body = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400,\"bar\":2},"
                + "\"spec\":{\"settlingTime\":\"0.15\",\"overshootPercent\":1.5},\"foo\":1}";
        assertEquals(
                List.of(
                        new FieldError("/plant/bar", "unknown field 'bar'"),
                        new FieldError("/spec/settlingTime", "wrong type: expected a JSON number"),
                        new FieldError("/foo", "unknown field 'foo'")),
                design(body).errors(),
                "the wrong-typed settling time is named once, not again as 'required'");
    }

    @Test
    void aWrongTypeInsideAnArrayIsNamedAtItsElementAndTheArrayIsNotCalledMissing() {
        String body = "{\"plant\":{\"form\":\"secondOrderTransferFunction\",\"numerator\":[400,\"x\"],"
                + "\"denominator\":[1,0.48,0]},\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":200},\"foo\":1}";
        List<FieldError> errors = design(body).errors();
        assertEquals(new FieldError("/plant/numerator/1", "wrong type: expected a JSON number"), errors.get(0));
        assertEquals(new FieldError("/foo", "unknown field 'foo'"), errors.get(1));
        assertEquals("/spec/overshootPercent", errors.get(2).pointer(), errors.toString());
        for (FieldError error : errors) {
            assertFalse(error.pointer().equals("/plant/numerator"), errors.toString());
        }
    }

    @Test
    void aSyntaxErrorAfterAnUnknownMemberIsNamedAtItsOwnPointerWithItsCause() {
        String[][] cases = {
            {"\"x\":1,\"x\":2", "duplicate key"}, {"\"x\":NaN", "NaN and Infinity"}, {"\"x\":1,", "trailing comma"}
        };
        for (String[] c : cases) {
            String body = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400,\"bar\":2},"
                    + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5,\"verify\":{" + c[0] + "}}}";
            List<FieldError> errors = design(body).errors();
            assertEquals(2, errors.size(), body + " " + errors);
            assertEquals(new FieldError("/plant/bar", "unknown field 'bar'"), errors.get(0));
            assertEquals("/spec/verify/x", errors.get(1).pointer(), body + " " + errors);
            assertTrue(errors.get(1).detail().contains(c[1]), errors.toString());
        }
    }

    @Test
    void aPlantThatIsNotPhysicalIsNamedWithTheUnknownMemberAndFourHundredWins() {
        // Alone, a negative mass is a 422 plant-model-unusable; with an unknown member the body is malformed first.
        String body = "{\"plant\":{\"form\":\"massSpringDamper\",\"mass\":-1,\"damping\":1,\"stiffness\":1},"
                + "\"spec\":" + SPEC + ",\"foo\":1}";
        Problem problem = design(body);
        assertEquals(400, problem.status());
        assertEquals(ProblemType.MALFORMED_REQUEST.uri(), problem.type());
        assertEquals(2, problem.errors().size(), problem.toString());
        assertEquals(
                new FieldError("/foo", "unknown field 'foo'"), problem.errors().get(0));
        assertEquals("/plant/mass", problem.errors().get(1).pointer());
        String alone = "{\"plant\":{\"form\":\"massSpringDamper\",\"mass\":-1,\"damping\":1,\"stiffness\":1},"
                + "\"spec\":" + SPEC + "}";
        assertEquals(422, design(alone).status());
    }

    @Test
    void theVerifyObjectsErrorsDeferredUntilAfterTheDesignAreNamedAtOnce() {
        String body = "{\"plant\":" + PLANT + ",\"spec\":" + SPEC
                + ",\"verify\":{\"tolerancePercent\":-5,\"frequencyPoints\":99999999999999},\"foo\":1}";
        List<FieldError> errors = design(body).errors();
        assertEquals("/verify/frequencyPoints", errors.get(0).pointer(), errors.toString());
        assertTrue(errors.get(0).detail().contains("whole-number"), errors.toString());
        assertEquals(new FieldError("/foo", "unknown field 'foo'"), errors.get(1));
        assertEquals("/verify/tolerancePercent", errors.get(2).pointer(), errors.toString());
        assertEquals(3, errors.size(), errors.toString());
    }

    @Test
    void aBatchItemIsAnsweredAsTheSameBodyAndIsNotChanged() throws Exception {
        String body = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400,\"bar\":2},"
                + "\"spec\":{\"settlingTime\":-1,\"overshootPercent\":1.5},\"foo\":1}";
        JsonNode item = STRICT.readTree(body);
        JsonNode copy = item.deepCopy();
        Answer fromItem = Answer.design(item);
        assertEquals(design(body), fromItem.problem());
        assertEquals(3, fromItem.problem().errors().size());
        assertEquals(copy, item, "the decoder takes members out of its own copy only");
    }

    @Test
    void oneErrorIsWordedAsBefore() {
        Problem problem = design("{\"plant\":" + PLANT + ",\"spec\":" + SPEC + ",\"foo\":1}");
        assertEquals("field /foo: unknown field 'foo'", problem.detail());
        assertEquals(List.of(new FieldError("/foo", "unknown field 'foo'")), problem.errors());
    }

    @Test
    void everyEndpointCollects() {
        String design = "{\"plant\":" + PLANT + ",\"spec\":{\"settlingTime\":-1,\"overshootPercent\":1.5},\"foo\":1}";
        Answer plot = Answer.plot("bode", bytes("{\"design\":" + design + ",\"actuatorLimit\":3}"));
        assertEquals(
                List.of(
                        new FieldError("/design/foo", "unknown field 'foo'"),
                        new FieldError("/design/spec/settlingTime", SETTLING_RANGE)),
                plot.problem().errors());
        Answer highOrder = Answer.highOrder(
                bytes("{\"plant\":{\"denominator\":[1.0,6.1,8.08,2.64],\"b\":1.0,\"disturbance\":[0.0,0.0,5.0]},"
                        + "\"spec\":{\"settlingTime\":-1,\"overshootPercent\":5.0},\"foo\":1}"));
        assertEquals(400, highOrder.status());
        assertEquals(2, highOrder.problem().errors().size(), highOrder.problem().toString());
        assertEquals(
                new FieldError("/foo", "unknown field 'foo'"),
                highOrder.problem().errors().get(0));
        assertEquals("/spec/settlingTime", highOrder.problem().errors().get(1).pointer());
    }

    @Test
    void theErrorsAreCappedAtTheContractsMaximum() {
        StringBuilder body = new StringBuilder("{\"plant\":" + PLANT + ",\"spec\":" + SPEC);
        for (int i = 0; i < 40; i++) {
            body.append(",\"unknown").append(i).append("\":").append(i);
        }
        Problem problem = design(body.append('}').toString());
        assertEquals(Problem.MAX_ERRORS, problem.errors().size());
        assertEquals("/unknown0", problem.errors().get(0).pointer());
        assertEquals(400, problem.status());
    }

    @Test
    void aRootThatIsNotAnObjectIsStillOneError() {
        Problem problem = design("[1,2]");
        assertEquals(1, problem.errors().size());
        assertEquals("", problem.errors().get(0).pointer());
        assertNull(Answer.design("[1,2]").text());
    }

    private static Problem design(String body) {
        Answer answer = Answer.design(body);
        assertFalse(answer.ok(), body);
        return answer.problem();
    }

    private static byte[] bytes(String text) {
        return text.getBytes(StandardCharsets.UTF_8);
    }
}
