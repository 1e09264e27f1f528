package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
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

    @Test
    void aRobustDesignWithIntegralActionIsA400AtRobust() {
        // the robust search covers the full-state loop only (its cases are two-state loops)
        LiveServer.Reply reply = server.post(
                "/v1/designs", "{" + AXIS + ",\"integralAction\":true,\"robust\":{\"uncertainty\":" + BOX + "}}");
        assertEquals(400, reply.status(), reply.text());
        assertTrue(reply.text().contains("\"/robust\""), reply.text());
    }
}
