package com.loopwright.api.highorder;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** The high-order endpoint's undershoot on the issue-12 reproduction, end to end without HTTP. */
class HighOrderUndershootExchangeTest {

    /**
     * Issue 12, item 5: this request answered undershootPercent 0.389865 (the lowest sample). Outside reference:
     * the independent check (numpy/scipy and 40-digit mpmath), 0.389930 % at t = 1.246 s.
     */
    @Test
    void undershootIsRefinedBetweenSamples() {
        String body = "{\"plant\":{\"denominator\":[1,1.192578756140489,0.41839321133113727,0.09303427763201173,"
                + "0.009078623638924007],\"b\":0.04340825295325368,\"numerator\":[-0.5782773668692388,1.0],"
                + "\"disturbance\":[0,0,0,0.022057260905507935]},\"spec\":{\"settlingTime\":12.039949496201748,"
                + "\"overshootPercent\":0.24565128665507857,\"settlingBandPercent\":5}}";
        Answer outcome = Answer.highOrder(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        JsonNode simulated = outcome.body().at("/simulated");
        assertEquals(0.389930, simulated.at("/undershootPercent").asDouble(), 5e-7);
    }
}
