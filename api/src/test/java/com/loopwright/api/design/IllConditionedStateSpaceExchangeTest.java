package com.loopwright.api.design;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import java.util.stream.StreamSupport;
import org.junit.jupiter.api.Test;

/** A state-space plant with a nearly singular controllability matrix states its condition and says so in notes. */
class IllConditionedStateSpaceExchangeTest {

    /**
     * A = R diag(-100, -200) R', B2 = R [1, 3e-9]' (R the rotation by 0.5 rad), scaled by 1024 (exact) so that b is
     * inside the canonical ranges, B1 = B2 / 2: cond_2 [B2, A B2]
     * = 3.334e10 (checked at 60 digits in the solver's IllConditionedStateSpaceTest). Outside reference for the
     * number: sigma_max / sigma_min of the 2 x 2 matrix from its Frobenius norm and determinant.
     */
    @Test
    void conditionNumberAndNoteAreInTheResponse() {
        String body = "{\"plant\":{\"form\":\"stateSpace\",\"a\":[[-122.98488470659302,42.07354924039484],"
                + "[42.07354924039482,-177.015115293407]],\"b2\":[898.6445419029465,490.9317542266375],"
                + "\"b1\":[449.32227095147323,245.46587711331875]},"
                + "\"spec\":{\"settlingTime\":0.01,\"overshootPercent\":1}}";
        Answer outcome = Answer.design(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        double condition =
                outcome.body().at("/model/stateSpace/controllabilityCondition").asDouble();
        assertEquals(3.334e10, condition, 0.001e10);
        assertTrue(
                StreamSupport.stream(outcome.body().at("/notes").spliterator(), false)
                        .map(JsonNode::asText)
                        .anyMatch(note -> note.contains("controllability matrix") && note.contains("3.33e+10")),
                () -> outcome.body().at("/notes").toString());
    }

    @Test
    void wellConditionedStateSpaceHasNoNote() {
        String body = "{\"plant\":{\"form\":\"stateSpace\",\"a\":[[0,50],[0,-2]],\"b2\":[0,3],\"b1\":[0,1]},"
                + "\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":1}}";
        Answer outcome = Answer.design(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        assertTrue(
                outcome.body().at("/model/stateSpace/controllabilityCondition").asDouble() < 100);
        assertTrue(StreamSupport.stream(outcome.body().at("/notes").spliterator(), false)
                .map(JsonNode::asText)
                .noneMatch(note -> note.contains("controllability matrix")));
    }
}
