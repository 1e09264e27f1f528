package com.loopwright.api.verification;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.loopwright.api.endpoint.Answer;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** POST /v1/verifications measures an overshoot whose peak comes after the base simulation window. */
class LatePeakVerificationTest {

    // Reproduction (issue 12, item 9): 0 was reported; the peak is at pi / wd = 0.718 s, past the old 0.633 s
    // window. Reference: the exact second-order step response (no zero), overshoot e^(-sigma pi / wd) with
    // sigma = (a1 + b k2) / 2 and wd = sqrt(a0 + b k1 - sigma^2) (any control textbook): 1.2240e-4 %.
    @Test
    void lateOvershootPeakIsReported() {
        String body =
                "{\"plant\":{\"form\":\"canonical\",\"a0\":158.26763769334335,\"a1\":10.807564793416091,\"b\":-8.24527590299888,"
                        + "\"d\":0.4354674102081221},\"gain\":{\"k1\":-26.698820246411938,\"k2\":-3.286906667311671,"
                        + "\"referenceGain\":-45.8937676993868}}";
        Answer outcome = Answer.verification(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        double a0 = 158.26763769334335;
        double a1 = 10.807564793416091;
        double b = -8.24527590299888;
        double sigma = 0.5 * (a1 + b * -3.286906667311671);
        double wd = Math.sqrt(a0 + b * -26.698820246411938 - sigma * sigma);
        double expected = 100 * Math.exp(-sigma * Math.PI / wd);
        assertEquals(
                expected,
                outcome.body().at("/robustness/nominal/overshootPercent").asDouble(),
                1e-4 * expected);
    }
}
