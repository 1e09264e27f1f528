package com.loopwright.api.takeaway;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/**
 * An exported controller of a state-space plant says that its inputs are the canonical states, and how to form them
 * from the caller's x: wiring the caller's own states into the block would apply the canonical gains to other
 * quantities.
 */
class StateSpaceExportInputsTest {

    private static final String OPTIONS = ",\"samplePeriod\":0.001,\"actuatorLimit\":5}";

    // The README's camera gimbal in angle and angular momentum: x1 = q, x2 = h = J q' with J = 0.02 kg m^2, so the
    // canonical states are z1 = q = x1 and z2 = q' = x2 / J = 50 x2 (definition of angular momentum, h = J q').
    @Test
    void theHeaderSaysHowToFormTheInputsFromTheCallersStates() {
        Answer answer = Answer.controller(
                "structured-text",
                ("{\"design\":{\"plant\":{\"form\":\"stateSpace\",\"a\":[[0,50],[0,-2]],\"b2\":[0,3],\"b1\":[0,1]},"
                                + "\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":1}}" + OPTIONS)
                        .getBytes(StandardCharsets.UTF_8));
        assertEquals(200, answer.status(), () -> String.valueOf(answer.problem()));
        String header = answer.text().replaceAll("\\s*\\*\\)\\s*\\(\\*\\s*", " ");
        assertTrue(header.contains("not your x"), header);
        assertTrue(header.contains("Y1 = z1 = 1.00000 x1 + (0.00000) x2"), header);
        assertTrue(header.contains("Y2 = z2 = dz1/dt = 0.00000 x1 + (50.0000) x2"), header);
    }

    @Test
    void aCanonicalPlantHasNoSuchLine() {
        Answer answer = Answer.controller(
                "structured-text",
                ("{\"design\":{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":2,\"b\":150,\"d\":50},"
                                + "\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":1}}" + OPTIONS)
                        .getBytes(StandardCharsets.UTF_8));
        assertEquals(200, answer.status());
        assertFalse(answer.text().contains("State-space plant"));
    }
}
