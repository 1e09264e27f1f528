package com.loopwright.api.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import org.junit.jupiter.api.Test;

/** The Bode figure states the phase and delay margins that the design's verification reports. */
class BodeMarginsAgreeTest {

    // Regression (issue 12, item 7): this loop crosses 0 dB at 1.812 and 5.4385 rad/s; the verification reported
    // phase margin -131.24 deg and delay margin 0, the figure its own (lowest) crossover. Reference values (numpy,
    // dense grid, and the argument-principle check in ClosedFormLoopMarginsTest): 114.69 deg at 5.4385 rad/s,
    // delay margin 0.3681 s.
    @Test
    void figureAndVerificationReportTheSameMargins() {
        String design = "{\"plant\":{\"form\":\"canonical\",\"a0\":10,\"a1\":2,\"b\":75,\"d\":6},"
                + "\"spec\":{\"overshootPercent\":0.2,\"settlingTime\":1.35},"
                + "\"verify\":{\"sampling\":{\"samplePeriod\":0.001},\"inputDelay\":0.2}}";
        Answer outcome = Answer.design(design.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        JsonNode margins = outcome.body().at("/robustness/margins");
        assertEquals(114.695, margins.at("/phaseMargin").asDouble(), 2e-3);
        assertEquals(5.43846, margins.at("/crossoverFrequency").asDouble(), 1e-4);
        assertEquals(0.368081, margins.at("/delayMargin").asDouble(), 1e-5);
        assertTrue(outcome.body().at("/robustness/delay/withinMargin").asBoolean());

        Answer bode = Answer.plot("bode", ("{\"design\":" + design + "}").getBytes(StandardCharsets.UTF_8));
        assertEquals(200, bode.status());
        String stated = String.format(
                Locale.ROOT,
                "phase margin %.1f deg, delay margin %s s",
                margins.at("/phaseMargin").asDouble(),
                DesignFigures.format(margins.at("/delayMargin").asDouble()));
        assertTrue(bode.text().contains(stated), stated);
        assertTrue(bode.text()
                .contains("gain crossover "
                        + DesignFigures.format(margins.at("/crossoverFrequency").asDouble()) + " rad/s"));
    }
}
