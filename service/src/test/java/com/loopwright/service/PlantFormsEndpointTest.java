package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.Iterator;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** POST /v1/designs with each plant description on the live server; every reply checked against the contract. */
class PlantFormsEndpointTest extends LiveServerTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    // Every request example of the contract is served, certified, and reports its own form.
    @Test
    void everyContractExampleIsACertifiedDesign() throws Exception {
        JsonNode examples = Contract.load()
                .document()
                .at("/paths/~1v1~1designs/post/requestBody/content/application~1json/examples");
        int count = 0;
        for (Iterator<Map.Entry<String, JsonNode>> it = examples.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> example = it.next();
            JsonNode request = example.getValue().get("value");
            var reply = server.post("/v1/designs", JSON.writeValueAsString(request));
            assertEquals(200, reply.status(), example.getKey() + ": " + reply.text());
            String form = request.at("/plant/form").asText("canonical");
            assertEquals(form, reply.json().at("/model/form").asText(), example.getKey());
            assertTrue(reply.json().at("/verification/certified").asBoolean(), example.getKey());
            count++;
        }
        assertTrue(count >= 5, "examples " + count);
    }

    // source: for the gimbal, B1 = (60/150) B2 and A is already canonical: T = I, so the caller's P equals the
    // canonical P and the residual in the caller's coordinates is that of the closed form.
    @Test
    void stateSpaceGimbalReturnsTheDesignInTheCallersCoordinates() {
        var reply = server.post("/v1/designs", """
                {"plant":{"form":"stateSpace","a":[[0,1],[0,-2]],"b2":[0,150],"b1":[0,60]},
                 "spec":{"settlingTime":0.3,"overshootPercent":1}}""");
        assertEquals(200, reply.status(), reply.text());
        JsonNode design = reply.json();
        JsonNode view = design.at("/model/stateSpace");
        assertEquals(1, view.at("/transform/0/0").asDouble(), 1e-14);
        assertEquals(0, view.at("/transform/0/1").asDouble(), 1e-14);
        assertEquals(
                design.at("/riccati/p/0/1").asDouble(),
                view.at("/p/0/1").asDouble(),
                1e-12 * design.at("/riccati/p/0/1").asDouble());
        assertEquals(design.at("/gain/k/0").asDouble(), view.at("/gain/0").asDouble(), 1e-12);
        assertTrue(view.get("riccatiResidual").asDouble() < 1e-10);
        var canonical = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":0,"a1":2,"b":150,"d":60},"spec":{"settlingTime":0.3,"overshootPercent":1}}""");
        assertEquals(
                canonical.json().at("/gain/k/1").asDouble(),
                design.at("/gain/k/1").asDouble(),
                1e-12);
    }

    @Test
    void unusablePlantDescriptionsAreProblemsThatNameTheField() {
        var negativeMass = server.post("/v1/designs", """
                {"plant":{"form":"massSpringDamper","mass":-2.5,"damping":4,"stiffness":150},
                 "spec":{"settlingTime":0.4,"overshootPercent":1}}""");
        assertEquals(422, negativeMass.status());
        assertEquals(
                "tag:loopwright.dev,2026:problem/plant-model-unusable",
                negativeMass.json().get("type").asText());
        assertEquals("/plant/mass", negativeMass.json().at("/errors/0/pointer").asText());
        var uncontrollable = server.post("/v1/designs", """
                {"plant":{"form":"stateSpace","a":[[-1,0],[0,-2]],"b2":[1,0]},
                 "spec":{"settlingTime":0.4,"overshootPercent":1}}""");
        assertEquals(422, uncontrollable.status());
        assertTrue(uncontrollable.json().get("detail").asText().contains("not controllable"));
        var wrongField = server.post("/v1/designs", """
                {"plant":{"form":"rotaryAxis","inertia":1,"viscousFriction":0,"torqueConstant":1,"mass":3},
                 "spec":{"settlingTime":0.4,"overshootPercent":1}}""");
        assertEquals(400, wrongField.status());
        assertEquals("/plant/mass", wrongField.json().at("/errors/0/pointer").asText());
    }
}
