package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.solver.design.StepMetrics;
import com.loopwright.solver.robustness.ParameterBox;
import com.loopwright.solver.robustness.ParameterSampler;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponseMetrics;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

/**
 * The robust member of POST /v1/designs on the live server (LiveServer checks every exchange against
 * openapi.yaml): the README axis designed for a load inertia from -20% to +50% (b and d from 1/J) and friction
 * +-20%, checked by the existing verification of that design over the same box.
 */
class RobustDesignEndpointTest extends LiveServerTest {

    private static final String AXIS = "\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}";
    private static final String BOX = "{\"a1\":{\"spreadPercent\":20},\"b\":{\"lowest\":266.7,\"highest\":500},"
            + "\"d\":{\"lowest\":266.7,\"highest\":500},\"monteCarloSamples\":200,\"seed\":7}";

    @Test
    void robustDesignOfTheReadmeAxisMeetsTheSpecAtEveryCornerAndSampleByItsVerification() {
        // verify with tolerancePercent 0 judges the spec as sent, the limits the robust design promises
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + "}," + "\"verify\":{\"uncertainty\":" + BOX
                        + ",\"tolerancePercent\":0}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode body = reply.json();
        JsonNode robust = body.get("robust");
        assertTrue(robust.get("meetsEverywhere").asBoolean());
        assertEquals("leastBandwidth", robust.get("selectionRule").asText());
        assertEquals(8, robust.get("corners").size());
        assertTrue(robust.get("evaluations").asInt() > 0);
        assertEquals(
                robust.at("/nominalTarget/naturalFrequency").asDouble(),
                body.at("/target/naturalFrequency").asDouble(),
                0);
        // the existing verification of the design, over the same corners and samples
        JsonNode uncertainty = body.at("/robustness/uncertainty");
        assertEquals(1.0, uncertainty.get("meetingFraction").asDouble(), 0);
        assertEquals(200, uncertainty.get("monteCarloSamples").asInt());
        assertTrue(uncertainty.at("/settlingTime/max").asDouble() <= 0.15);
        assertTrue(uncertainty.at("/overshootPercent/max").asDouble() <= 1.5);
        for (JsonNode check : body.at("/robustness/checks")) {
            if (check.get("check").asText().equals("uncertainty")) {
                assertTrue(check.get("passed").asBoolean(), check.toString());
            }
        }
        // without the robust member the same verification fails part of the box (README)
        LiveServer.Reply plain = server.post(
                "/v1/designs", "{" + AXIS + ",\"verify\":{\"uncertainty\":" + BOX + ",\"tolerancePercent\":0}}");
        assertTrue(plain.json().at("/robustness/uncertainty/meetingFraction").asDouble() < 1);
        for (JsonNode corner : robust.get("corners")) {
            assertTrue(corner.get("hInfinityNorm").asDouble() > 0);
        }
    }

    @Test
    void anActuatorLimitTheBoxCannotMeetIsInfeasibleWithAReadyToSendProposal() {
        LiveServer.Reply reply = server.post(
                "/v1/designs", "{" + AXIS + ",\"robust\":{\"uncertainty\":" + BOX + ",\"actuatorLimit\":2}}");
        assertEquals(422, reply.status(), reply.text());
        JsonNode proposal = reply.json().at("/proposals/0");
        assertEquals("/spec/settlingTime", proposal.get("pointer").asText(), proposal.toString());
        double settling = proposal.at("/spec/settlingTime").asDouble();
        assertTrue(settling > 0.15);
        LiveServer.Reply again = server.post(
                "/v1/designs",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":"
                        + proposal.get("spec") + ",\"robust\":{\"uncertainty\":" + BOX + ",\"actuatorLimit\":2}}");
        assertEquals(200, again.status(), again.text());
        assertTrue(
                again.json().at("/robust/priceOfRobustness/worst/peakControl").asDouble() <= 2);
    }

    @Test
    void aRobustMemberWithoutABoxIsA400AtItsPointer() {
        LiveServer.Reply reply = server.post("/v1/designs", "{" + AXIS + ",\"robust\":{\"actuatorLimit\":2}}");
        assertEquals(400, reply.status(), reply.text());
        assertTrue(reply.text().contains("/robust/uncertainty"), reply.text());
    }

    /**
     * The spec as sent, with the agreement of two exact step simulations on different grids (1e-6 relative, from
     * memory of the event refinement's accuracy): the search's binding case sits on the limit.
     */
    private static final double SETTLING_LIMIT = 0.15 * (1 + 1e-6);

    private static final double OVERSHOOT_LIMIT = 1.5 + 1e-6;

    /** The README axis's box with every range as explicit bounds (the test draws the same samples). */
    private static final String EXPLICIT_BOX = "{\"a1\":{\"lowest\":0.384,\"highest\":0.576},"
            + "\"b\":{\"lowest\":266.7,\"highest\":500},\"d\":{\"lowest\":266.7,\"highest\":500},"
            + "\"monteCarloSamples\":40,\"seed\":7}";

    /**
     * Robust design with integral action: every corner is checked by POST /v1/verifications (its loop section
     * assembles and simulates the caller's law on the corner plant) and every sample by a step simulated here on
     * a loop matrix written out by hand (x1' = x2, x2' = -a0 x1 - a1 x2 + b u, xi' = r - x1,
     * u = kr r + ki xi - k1 x1 - k2 x2; the integral law as the README states it). Limits: the spec as sent.
     */
    @Test
    void robustDesignWithIntegralActionMeetsTheSpecAtEveryCornerAndSampleCheckedIndependently() {
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + AXIS + ",\"integralAction\":true,\"robust\":{\"uncertainty\":" + EXPLICIT_BOX + "}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode body = reply.json();
        JsonNode robust = body.get("robust");
        assertEquals("integralAction", robust.get("judgedLoop").asText());
        assertTrue(robust.get("meetsEverywhere").asBoolean(), robust.toString());
        assertEquals(8, robust.get("corners").size());
        JsonNode law = body.at("/law");
        double k1 = law.at("/k/0").asDouble();
        double k2 = law.at("/k/1").asDouble();
        double kr = law.get("referenceGain").asDouble();
        double ki = law.get("integralGain").asDouble();
        String gain = "\"gain\":{\"k1\":" + k1 + ",\"k2\":" + k2 + ",\"referenceGain\":" + kr + ",\"integralGain\":"
                + ki + "}";
        for (JsonNode corner : robust.get("corners")) {
            JsonNode p = corner.get("plant");
            LiveServer.Reply check = server.post(
                    "/v1/verifications",
                    "{\"plant\":{\"form\":\"canonical\",\"a0\":" + p.get("a0") + ",\"a1\":" + p.get("a1")
                            + ",\"b\":" + p.get("b") + ",\"d\":" + p.get("d") + "}," + gain
                            + ",\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}");
            assertEquals(200, check.status(), check.text());
            JsonNode step = check.json().at("/loop/step");
            assertTrue(step.get("settlingTime").asDouble() <= SETTLING_LIMIT, corner + " " + step);
            assertTrue(step.get("overshootPercent").asDouble() <= OVERSHOOT_LIMIT, corner + " " + step);
        }
        // the same seeded samples (ParameterSampler, one definition for every consumer), simulated here
        ParameterSampler sampler =
                new ParameterSampler(new ParameterBox(0, 0, 0.384, 0.576, 266.7, 500, 266.7, 500), 7);
        for (int s = 0; s < 40; s++) {
            double[] p = sampler.next();
            double b = p[2];
            DMatrixRMaj a =
                    new DMatrixRMaj(new double[][] {{0, 1, 0}, {-p[0] - b * k1, -p[1] - b * k2, b * ki}, {-1, 0, 0}});
            LinearLoop loop = new LinearLoop(
                    a,
                    new DMatrixRMaj(new double[][] {{0}, {b * kr}, {1}}),
                    new DMatrixRMaj(new double[][] {{1, 0, 0}}),
                    new DMatrixRMaj(new double[][] {{-k1, -k2, ki}}),
                    kr);
            StepMetrics m = new StepResponseMetrics().measure(loop, 1, 3, 30_000, 0.02);
            assertTrue(m.settlingTimeSeconds() <= SETTLING_LIMIT, "sample " + s + ": " + m);
            assertTrue(m.overshootPercent() <= OVERSHOOT_LIMIT, "sample " + s + ": " + m);
        }
    }

    @Test
    void aRobustIntegralDesignTheActuatorCannotMeetIsInfeasibleWithAReadyToSendProposal() {
        String loop = ",\"integralAction\":true,\"robust\":{\"uncertainty\":" + EXPLICIT_BOX + ",\"actuatorLimit\":2}}";
        LiveServer.Reply reply = server.post("/v1/designs", "{" + AXIS + loop);
        assertEquals(422, reply.status(), reply.text());
        JsonNode proposal = reply.json().at("/proposals/0");
        assertEquals("/spec/settlingTime", proposal.get("pointer").asText(), proposal.toString());
        assertTrue(proposal.at("/spec/settlingTime").asDouble() > 0.15);
        LiveServer.Reply again = server.post(
                "/v1/designs",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":"
                        + proposal.get("spec") + loop);
        assertEquals(200, again.status(), again.text());
        assertTrue(
                again.json().at("/robust/priceOfRobustness/worst/peakControl").asDouble() <= 2);
    }

    /** Position-only sensing: the observer as designed for the nominal plant runs on every perturbed case. */
    @Test
    void robustDesignWithAnObserverJudgesTheOutputFeedbackLoop() {
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + AXIS + ",\"integralAction\":true,\"measurement\":\"position\","
                        + "\"observer\":{\"method\":\"poleMultiple\",\"multiple\":5},\"robust\":{\"uncertainty\":"
                        + EXPLICIT_BOX + "}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode robust = reply.json().get("robust");
        assertEquals("integralActionPositionObserver", robust.get("judgedLoop").asText());
        assertTrue(robust.get("meetsEverywhere").asBoolean(), robust.toString());
        // the limits as sent (common practice: a worst case on the limit, not past it)
        assertTrue(robust.at("/priceOfRobustness/worst/settlingTime").asDouble() <= 0.15);
        assertTrue(robust.at("/priceOfRobustness/worst/overshootPercent").asDouble() <= 1.5);
        assertTrue(reply.json().has("observer"), "the loop's sections are those of the chosen target");
    }

    @Test
    void aRobustLoopDesignWithTooManySamplesIsA400AtTheSampleCount() {
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + AXIS + ",\"integralAction\":true,\"robust\":{\"uncertainty\":{\"b\":{\"spreadPercent\":10},"
                        + "\"monteCarloSamples\":201}}}");
        assertEquals(400, reply.status(), reply.text());
        assertTrue(reply.text().contains("/robust/uncertainty/monteCarloSamples"), reply.text());
    }
}
