package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import org.junit.jupiter.api.Test;

/** Specs the plant cannot meet get a 422 naming the field, the reason and a computed spec that works. */
class InfeasibleSpecTest extends LiveServerTest {

    private static JsonNode proposal(JsonNode problem, String pointer) {
        for (JsonNode p : problem.get("proposals")) {
            if (p.get("pointer").asText().equals(pointer)) {
                return p;
            }
        }
        throw new AssertionError("no proposal for " + pointer + " in " + problem);
    }

    // source: project method notes: a pure inertia needs zeta >= 1/sqrt(2) (overshoot at most ~4.3%).
    @Test
    void tooMuchOvershootForAnIndexingAxis() {
        var reply = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":10}}""");
        assertEquals(422, reply.status(), reply.text());
        assertEquals(
                "/spec/overshootPercent", reply.json().at("/errors/0/pointer").asText());
        assertTrue(reply.json().get("detail").asText().contains("1/sqrt(2)"), reply.text());
        double proposed =
                proposal(reply.json(), "/spec/overshootPercent").get("value").asDouble();
        assertTrue(proposed < 4.33 && proposed > 3.5, "proposal " + proposed);
        var retry = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},"spec":{"settlingTime":0.15,"overshootPercent":%s}}""".formatted(proposed));
        assertEquals(200, retry.status(), retry.text());
    }

    // A heavily self-damped tank loop asked to settle slower than it already does.
    @Test
    void specSlowerThanThePlantProposesAShorterTime() {
        String body = """
                {"plant":{"form":"canonical","a0":0,"a1":4,"b":2,"d":1},"spec":{"settlingTime":10,"overshootPercent":1}}""";
        var reply = server.post("/v1/designs", body);
        assertEquals(422, reply.status(), reply.text());
        assertEquals("/spec/settlingTime", reply.json().at("/errors/0/pointer").asText());
        double proposed =
                proposal(reply.json(), "/spec/settlingTime").get("value").asDouble();
        assertTrue(proposed < 10);
        var retry = server.post("/v1/designs", body.replace("\"settlingTime\":10", "\"settlingTime\":" + proposed));
        assertEquals(200, retry.status(), retry.text());
    }

    @Test
    void gammaBelowItsBoundIsRejected() {
        var reply = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":0,"a1":0.48,"b":400,"d":400},
                 "spec":{"settlingTime":0.15,"overshootPercent":1.5,"gamma":1e-6}}""");
        assertEquals(422, reply.status(), reply.text());
        assertEquals("/spec/gamma", reply.json().at("/errors/0/pointer").asText());
        assertTrue(proposal(reply.json(), "/spec/gamma").get("value").asDouble() > 1e-6);
    }
}
