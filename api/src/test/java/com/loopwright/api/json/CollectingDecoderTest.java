package com.loopwright.api.json;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.problem.FieldError;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Which member the decoder takes out for a failure at a pointer, and which validation errors repeat one. */
class CollectingDecoderTest {

    private static final ObjectMapper STRICT = StrictJson.newMapper();

    @Test
    void aMemberOfAnObjectIsTakenOutItself() throws Exception {
        JsonNode tree = STRICT.readTree("{\"plant\":{\"a0\":1,\"a~b/c\":2},\"spec\":{}}");
        assertEquals("/plant/a0", CollectingDecoder.takeOut(tree, "/plant/a0"));
        assertEquals("/plant/a~0b~1c", CollectingDecoder.takeOut(tree, "/plant/a~0b~1c"));
        assertEquals(STRICT.readTree("{\"plant\":{},\"spec\":{}}"), tree);
    }

    @Test
    void anArrayElementTakesOutTheArraysMember() throws Exception {
        JsonNode tree = STRICT.readTree("{\"plant\":{\"numerator\":[1,[2,\"x\"]],\"b\":1}}");
        assertEquals("/plant/numerator", CollectingDecoder.takeOut(tree, "/plant/numerator/1/1"));
        assertEquals(STRICT.readTree("{\"plant\":{\"b\":1}}"), tree);
    }

    @Test
    void nothingIsTakenAtTheRootOrWhereNothingIs() throws Exception {
        JsonNode tree = STRICT.readTree("{\"a\":1}");
        assertNull(CollectingDecoder.takeOut(tree, ""));
        assertNull(CollectingDecoder.takeOut(tree, "/b"));
        assertNull(CollectingDecoder.takeOut(STRICT.readTree("[1,2]"), "/1"));
        assertEquals(STRICT.readTree("{\"a\":1}"), tree);
    }

    @Test
    void aValidationErrorAtOrBelowATakenMemberRepeatsIt() {
        CollectingDecoder.Outcome<Object> outcome = new CollectingDecoder.Outcome<>(
                "x", List.of(new FieldError("/plant/numerator/1", "wrong type")), List.of("/plant/numerator"));
        assertTrue(outcome.repeats(new FieldError("/plant/numerator", "required")));
        assertTrue(outcome.repeats(new FieldError("/plant/numerator/0", "must be finite")));
        assertFalse(outcome.repeats(new FieldError("/plant/numeratorScale", "required")));
        assertFalse(outcome.repeats(new FieldError("/plant", "no form")));
    }
}
