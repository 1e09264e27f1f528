package com.loopwright.api.highorder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** The high-order endpoint's norm on the issue-12 reproduction, end to end without HTTP. */
class HighOrderNormExchangeTest {

    /**
     * Issue 12, item 1: this request answered a peak disturbance gain (then hinfNorm) of 3971.748 at 44.94 rad/s. Outside reference: the issue's
     * independent check (numpy/scipy and 40-digit mpmath), true peak 3973.374 at 46.71 rad/s.
     */
    @Test
    void badlyScaledOrderFiveLoopReportsTheCertifiedPeak() {
        String body = "{\"plant\":{\"denominator\":[1,24.903359880407102,164.76062175845746,"
                + "1093.8567775813508,2443.8582808398724,3286.5795497977865],\"b\":0.36536984243058584,"
                + "\"numerator\":[-0.010096282201076452,1.0],\"disturbance\":[0,0,0,0,988.6561066119183]},"
                + "\"spec\":{\"settlingTime\":0.41617516156597156,\"overshootPercent\":2.3321485160205992},"
                + "\"matchSpecs\":true}";
        Answer outcome = Answer.highOrder(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        JsonNode verification = outcome.body().at("/verification");
        double tolerance =
                verification.at("/peakDisturbanceGainRelativeTolerance").asDouble();
        assertEquals(1e-10, tolerance);
        double norm = verification.at("/peakDisturbanceGain").asDouble();
        assertTrue(norm >= 3973.3735 && norm <= 3973.3745, "peakDisturbanceGain " + norm);
        assertEquals(46.71, verification.at("/peakDisturbanceGainFrequency").asDouble(), 0.005);
    }
}
