package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.loopwright.examples.DesignClient;
import java.net.URI;
import org.junit.jupiter.api.Test;

/** POST /v1/designs on the real server: designs that meet their specs, verified and schema-valid. */
class DesignEndpointTest extends LiveServerTest {

    private static void assertSpecsMet(JsonNode design, double settlingTime, double overshootPercent) {
        JsonNode simulated = design.get("simulated");
        // Quality bar of the project: simulated settling within 0.5% and overshoot within 0.02 points of the spec.
        assertEquals(settlingTime, simulated.get("settlingTime").asDouble(), 0.005 * settlingTime);
        assertEquals(overshootPercent, simulated.get("overshootPercent").asDouble(), 0.02);
        assertTrue(design.at("/verification/specsMet").asBoolean(), design.toString());
        assertTrue(design.at("/verification/certified").asBoolean(), design.toString());
        assertTrue(design.at("/verification/peakDisturbanceGain").asDouble()
                <= design.get("gamma").asDouble());
    }

    // The README scenario: packaging-line indexing axis.
    @Test
    void indexingAxisDesignIsCertifiedAndMeetsItsSpecs() {
        var reply = server.post("/v1/designs", DesignClient.INDEXING_AXIS);
        assertEquals(200, reply.status(), reply.text());
        JsonNode design = reply.json();
        assertSpecsMet(design, 0.15, 1.5);
        // source: overshoot formula zeta = -ln OS / sqrt(pi^2 + ln^2 OS) at OS = 0.015.
        double ln = Math.log(0.015);
        assertEquals(
                -ln / Math.hypot(Math.PI, ln), design.at("/target/dampingRatio").asDouble(), 1e-12);
        // source: pole matching, a1 + b k2 = 2 zeta wn and a0 + b k1 = wn^2 (closed-loop polynomial).
        double zeta = design.at("/target/dampingRatio").asDouble();
        double wn = design.at("/target/naturalFrequency").asDouble();
        assertEquals(2 * zeta * wn, 0.48 + 400 * design.at("/gain/k/1").asDouble(), 1e-9 * wn);
        assertEquals(wn * wn, 400 * design.at("/gain/k/0").asDouble(), 1e-9 * wn * wn);
        assertTrue(design.at("/riccati/residualNorm").asDouble() < 1e-12);
        assertTrue(design.at("/riccati/numeric/relativeDifference").asDouble() < 1e-8);
        assertEquals(
                1.2 * design.get("gammaMin").asDouble(), design.get("gamma").asDouble(), 1e-12);
        assertTrue(design.get("cautions").size() >= 3);
    }

    // A tank-level loop (stable, self-regulating: a0 > 0) specified by rise time, band 5%.
    @Test
    void riseTimeSpecIsMetExactly() {
        var reply = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":0.04,"a1":0.5,"b":0.02,"d":0.05},
                 "spec":{"riseTime":3,"overshootPercent":2,"settlingBandPercent":5}}""");
        assertEquals(200, reply.status(), reply.text());
        JsonNode design = reply.json();
        assertEquals(3, design.at("/simulated/riseTime").asDouble(), 1e-5);
        assertEquals(2, design.at("/simulated/overshootPercent").asDouble(), 1e-5);
        assertEquals("riseTime", design.at("/target/bindingSpecs/1").asText());
        assertTrue(design.at("/verification/certified").asBoolean());
    }

    // A camera gimbal axis with a caller-chosen gamma and a 10-degree step.
    @Test
    void fixedGammaAndStepSizeAreHonoured() {
        var first = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":0,"a1":2,"b":150,"d":60},"spec":{"settlingTime":0.3,"overshootPercent":1}}""");
        double gamma = 3 * first.json().get("gammaMin").asDouble();
        var reply = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":0,"a1":2,"b":150,"d":60},
                 "spec":{"settlingTime":0.3,"overshootPercent":1,"gamma":%s,"stepSize":10}}""".formatted(gamma));
        assertEquals(200, reply.status(), reply.text());
        assertEquals(gamma, reply.json().get("gamma").asDouble(), 1e-12 * gamma);
        assertSpecsMet(reply.json(), 0.3, 1);
        // source: linearity: the peak control of a step of 10 is 10 times that of a unit step.
        assertEquals(
                10 * first.json().at("/simulated/peakControl").asDouble(),
                reply.json().at("/simulated/peakControl").asDouble(),
                1e-9 * reply.json().at("/simulated/peakControl").asDouble());
    }

    @Test
    void noDisturbanceChannelGivesAFreeGamma() {
        var reply = server.post("/v1/designs", """
                {"plant":{"form":"canonical","a0":1,"a1":0.1,"b":3,"d":0},"spec":{"settlingTime":2,"overshootPercent":0.5}}""");
        assertEquals(200, reply.status(), reply.text());
        assertEquals(0, reply.json().get("gammaMin").asDouble());
        assertEquals(0, reply.json().at("/verification/peakDisturbanceGain").asDouble());
        assertSpecsMet(reply.json(), 2, 0.5);
    }

    @Test
    void contractAndHealthAreServed() throws Exception {
        var contract = server.get("/openapi.yaml");
        assertEquals(200, contract.status());
        assertEquals(java.nio.file.Files.readString(Contract.FILE), contract.text());
        var health = server.get("/health");
        assertEquals(200, health.status());
        assertEquals("up", health.json().get("status").asText());
    }

    // The Java client other teams copy runs the README scenario against the live server.
    @Test
    void copyableJavaClientGetsACertifiedDesign() throws Exception {
        DesignClient.Reply reply =
                new DesignClient(URI.create(server.base().toString())).design(DesignClient.INDEXING_AXIS);
        assertTrue(reply.certified(), reply.body());
        assertTrue(reply.gains()[0] > 0 && reply.gains()[1] > 0);
    }
}
