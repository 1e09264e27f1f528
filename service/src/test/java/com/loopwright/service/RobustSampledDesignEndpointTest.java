package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.ParameterSampler;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * robust.samplePeriod of POST /v1/designs on the live server (LiveServer checks every exchange against
 * openapi.yaml): the README axis (RobustDesignEndpointTest's AXIS and box) designed so that the loop the exported
 * controller runs at the period meets the spec on every corner and sample, checked case by case by the existing
 * verification route (POST /v1/verifications with verify.sampling at the same period, tolerancePercent 0: its
 * emulated sampled section), not by the search's own judge.
 */
class RobustSampledDesignEndpointTest extends LiveServerTest {

    private static final String PLANT = "\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}";
    private static final String SPEC = "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}";
    private static final String AXIS = PLANT + "," + SPEC;
    /** RobustDesignEndpointTest's box with explicit bounds (the test draws the same samples), 40 samples. */
    private static final String BOX = "{\"a1\":{\"lowest\":0.384,\"highest\":0.576},"
            + "\"b\":{\"lowest\":266.7,\"highest\":500},\"d\":{\"lowest\":266.7,\"highest\":500},"
            + "\"monteCarloSamples\":40,\"seed\":7}";

    private static final ParameterBox PARAMETER_BOX = new ParameterBox(0, 0, 0.384, 0.576, 266.7, 500, 266.7, 500);
    private static final int SAMPLES = 40;
    private static final long SEED = 7;

    /**
     * A period at which the continuous robust design's law cannot be exported (its wn T exceeds 0.5), so the sampled
     * search must move to a slower target that still meets the spec sampled.
     */
    private static final double LONG_PERIOD = 0.0123;

    @Test
    void sampledRobustDesignsMeetTheSpecAtEveryCornerAndSampleByTheVerificationRoute() {
        for (double period : new double[] {0.004, LONG_PERIOD}) {
            LiveServer.Reply reply = server.post(
                    "/v1/designs",
                    "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + ",\"samplePeriod\":" + period + "}}");
            assertEquals(200, reply.status(), reply.text());
            JsonNode body = reply.json();
            JsonNode robust = body.get("robust");
            assertEquals("sampledStateFeedback", robust.get("judgedLoop").asText());
            assertEquals(period, robust.get("samplePeriod").asDouble(), 0);
            assertTrue(robust.get("meetsEverywhere").asBoolean(), robust.toString());
            // the exported law exists at this period: wn T <= 0.5 (the controller exports' rule, openapi.yaml)
            assertTrue(body.at("/target/naturalFrequency").asDouble() * period <= 0.5);
            for (JsonNode check : verifyEveryCase(body, period)) {
                JsonNode sampled = check.at("/robustness/sampled");
                // the spec as sent (tolerancePercent 0): the verification's own verdict and its numbers
                assertTrue(sampled.get("emulatedMeetsSpec").asBoolean(), sampled.toString());
                assertTrue(sampled.at("/emulated/settlingTime").asDouble() <= 0.15, sampled.toString());
                assertTrue(sampled.at("/emulated/overshootPercent").asDouble() <= 1.5, sampled.toString());
                assertTrue(sampled.get("spectralRadius").asDouble() < 1, sampled.toString());
            }
        }
    }

    @Test
    void atTheLongPeriodTheContinuousRobustTargetCannotBeExportedSoTheSampledSearchMoves() {
        JsonNode continuous = server.post("/v1/designs", "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + "}}")
                .json();
        JsonNode sampled = server.post(
                        "/v1/designs",
                        "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + ",\"samplePeriod\":" + LONG_PERIOD + "}}")
                .json();
        double continuousFrequency = continuous.at("/target/naturalFrequency").asDouble();
        double sampledFrequency = sampled.at("/target/naturalFrequency").asDouble();
        // the controller exports refuse a law with wn T above 0.5 (openapi.yaml, the export operations)
        assertTrue(continuousFrequency * LONG_PERIOD > 0.5, "continuous wn T = " + continuousFrequency * LONG_PERIOD);
        assertTrue(sampledFrequency * LONG_PERIOD <= 0.5, "sampled wn T = " + sampledFrequency * LONG_PERIOD);
        assertTrue(sampled.at("/robust/meetsEverywhere").asBoolean());
        assertFalse(continuous.get("robust").has("samplePeriod"));
        assertFalse(continuous.get("robust").has("judgedLoop"));
    }

    /** One POST /v1/verifications per corner (from the response) and per seeded sample, with the design's gains. */
    private List<JsonNode> verifyEveryCase(JsonNode design, double period) {
        List<double[]> plants = new ArrayList<>();
        for (JsonNode corner : design.at("/robust/corners")) {
            JsonNode p = corner.get("plant");
            plants.add(new double[] {
                p.get("a0").asDouble(),
                p.get("a1").asDouble(),
                p.get("b").asDouble(),
                p.get("d").asDouble()
            });
        }
        ParameterSampler sampler = new ParameterSampler(PARAMETER_BOX, SEED);
        for (int s = 0; s < SAMPLES; s++) {
            plants.add(sampler.next());
        }
        assertEquals(8 + SAMPLES, plants.size());
        String gain = "\"gain\":{\"k1\":" + design.at("/gain/k/0").asDouble() + ",\"k2\":"
                + design.at("/gain/k/1").asDouble() + ",\"referenceGain\":"
                + design.at("/gain/referenceGain").asDouble() + "}";
        List<JsonNode> checks = new ArrayList<>();
        for (double[] p : plants) {
            LiveServer.Reply check = server.post(
                    "/v1/verifications",
                    "{\"plant\":{\"form\":\"canonical\",\"a0\":" + p[0] + ",\"a1\":" + p[1] + ",\"b\":" + p[2]
                            + ",\"d\":" + p[3] + "}," + gain + "," + SPEC + ",\"verify\":{\"sampling\":{"
                            + "\"samplePeriod\":" + period + "},\"tolerancePercent\":0}}");
            assertEquals(200, check.status(), check.text());
            checks.add(check.json());
        }
        return checks;
    }

    @Test
    void theLoopWithIntegralActionIsJudgedAsItsDiscreteControllerRuns() {
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + AXIS + ",\"integralAction\":true,\"robust\":{\"uncertainty\":" + BOX
                        + ",\"samplePeriod\":0.002}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode robust = reply.json().get("robust");
        assertEquals("sampledIntegralAction", robust.get("judgedLoop").asText());
        assertEquals(0.002, robust.get("samplePeriod").asDouble(), 0);
        assertTrue(robust.get("meetsEverywhere").asBoolean(), robust.toString());
        // the limits as sent (common practice: a worst case on the limit, not past it)
        assertTrue(robust.at("/priceOfRobustness/worst/settlingTime").asDouble() <= 0.15);
        assertTrue(robust.at("/priceOfRobustness/worst/overshootPercent").asDouble() <= 1.5);
    }

    @Test
    void aPeriodTooLongForTheSpecIs422AtTheRobustSamplePeriod() {
        // wn T <= 0.5 caps wn at 0.1 rad/s, below a sixteenth of the requested natural frequency
        LiveServer.Reply reply = server.post(
                "/v1/designs", "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + ",\"samplePeriod\":5}}");
        assertEquals(422, reply.status(), reply.text());
        assertEquals(
                "/robust/samplePeriod", reply.json().at("/errors/0/pointer").asText(), reply.text());
        assertTrue(reply.json().get("detail").asText().contains("sample periods"), reply.text());
    }

    @Test
    void aPeriodTheBoxCannotMeetTheSpecAtProposesTheBestSpecAtThatPeriodReadyToSend() {
        String robust = ",\"robust\":{\"uncertainty\":" + BOX + ",\"samplePeriod\":0.014}}";
        LiveServer.Reply reply = server.post("/v1/designs", "{" + AXIS + robust);
        assertEquals(422, reply.status(), reply.text());
        JsonNode proposal = reply.json().at("/proposals/0");
        assertEquals("/spec/settlingTime", proposal.get("pointer").asText(), proposal.toString());
        assertTrue(proposal.at("/spec/settlingTime").asDouble() > 0.15);
        LiveServer.Reply again = server.post("/v1/designs", "{" + PLANT + ",\"spec\":" + proposal.get("spec") + robust);
        assertEquals(200, again.status(), again.text());
        assertTrue(again.json().at("/robust/meetsEverywhere").asBoolean());
    }

    @Test
    void aRiseTimeSpecIsJudgedSampledToo() {
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + PLANT + ",\"spec\":{\"riseTime\":0.08,\"overshootPercent\":1.5},\"robust\":{\"uncertainty\":"
                        + BOX + ",\"samplePeriod\":0.004}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode robust = reply.json().get("robust");
        assertTrue(robust.get("meetsEverywhere").asBoolean(), robust.toString());
        assertTrue(robust.at("/priceOfRobustness/worst/riseTime").asDouble() <= 0.08);
    }

    @Test
    void hostileSamplePeriodsAre400AtTheirPointerAndNever500() {
        for (String period : new String[] {"0", "-0.004", "1e5", "1e308", "\"0.004\"", "true", "[]", "{}", "NaN"}) {
            LiveServer.Reply reply = server.post(
                    "/v1/designs",
                    "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + ",\"samplePeriod\":" + period + "}}");
            assertEquals(400, reply.status(), period + ": " + reply.text());
            if (!period.equals("NaN")) {
                assertEquals(
                        "/robust/samplePeriod",
                        reply.json().at("/errors/0/pointer").asText(),
                        period + ": " + reply.text());
            }
        }
        // a period so short that the sampled step needs more intervals than the simulator's cap: 422, not 500
        LiveServer.Reply shortest = server.post(
                "/v1/designs", "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + ",\"samplePeriod\":1e-7}}");
        assertEquals(422, shortest.status(), shortest.text());
        assertEquals(
                "/robust/samplePeriod", shortest.json().at("/errors/0/pointer").asText(), shortest.text());
        // more samples than a simulated search takes
        LiveServer.Reply many = server.post(
                "/v1/designs",
                "{" + AXIS + ",\"robust\":{\"uncertainty\":{\"b\":{\"spreadPercent\":10},\"monteCarloSamples\":201},"
                        + "\"samplePeriod\":0.004}}");
        assertEquals(400, many.status(), many.text());
        assertEquals(
                "/robust/uncertainty/monteCarloSamples",
                many.json().at("/errors/0/pointer").asText(),
                many.text());
    }
}
