package com.loopwright.api.takeaway;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** A sample period copied from the export's refusal advice is accepted when posted back. */
class SamplePeriodAdviceTest {

    /** The README axis. */
    private static final String DESIGN = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";

    private static final Pattern ADVICE = Pattern.compile("at most ([0-9.eE+-]+) s");

    private Answer export(double period) {
        String body = "{\"design\":" + DESIGN + ",\"samplePeriod\":" + period + ",\"actuatorLimit\":10}";
        return Answer.controller("parameters", body.getBytes(StandardCharsets.UTF_8));
    }

    // Reproduction (issue 12, item 8): 0.02074 s was refused with "use at most 0.01994 s", and 0.01994 s was
    // refused in turn (wn T = 0.500 > 0.5) because the advice 0.5 / wn = 0.019937... had been rounded up.
    // Reference: wn T <= 0.5 with wn from the design's own target (the rule the refusal states), evaluated here.
    @Test
    void advisedPeriodIsAcceptedWhenPostedBack() {
        Answer refused = export(0.02074);
        assertEquals(422, refused.status());
        assertNotNull(refused.problem());
        Matcher advice = ADVICE.matcher(refused.problem().detail());
        assertTrue(advice.find(), refused.problem().detail());
        double advised = Double.parseDouble(advice.group(1));
        assertTrue(advised < 0.01994, "rounded down from 0.019937...: " + advised);
        Answer accepted = export(advised);
        assertEquals(200, accepted.status(), () -> String.valueOf(accepted.problem()));
        assertTrue(accepted.text().contains("\"periodPerTimeConstant\""));
    }

    // The same round trip over a sweep of refused periods: the advice is always accepted and at most one unit of
    // its last printed digit below the true limit 0.5 / wn.
    @Test
    void everyAdviceInASweepIsAccepted() {
        for (int i = 0; i < 12; i++) {
            double period = 0.0200 + 0.0007 * i;
            Answer refused = export(period);
            if (refused.status() == 200) {
                continue;
            }
            Matcher advice = ADVICE.matcher(refused.problem().detail());
            assertTrue(advice.find(), refused.problem().detail());
            double advised = Double.parseDouble(advice.group(1));
            Answer accepted = export(advised);
            assertEquals(200, accepted.status(), () -> advised + ": " + accepted.problem());
            assertTrue(export(advised + 2e-5).status() == 422, "the advice is within one printed unit of the limit");
        }
    }
}
