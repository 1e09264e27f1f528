package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.*;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** POST /v1/designs/high-order on the real server; LiveServer validates every reply against openapi.yaml. */
class HighOrderEndpointTest extends LiveServerTest {

    private static final String PATH = "/v1/designs/high-order";

    /** The contract's own example (README scenario): spec matching meets the simulated specs, design verified. */
    @Test
    void contractExampleMatchesTheSpecsAndIsCertified() throws Exception {
        JsonNode example = Contract.load()
                .document()
                .at("/paths/~1v1~1designs~1high-order/post/requestBody/content"
                        + "/application~1json/examples/pickAndPlaceAxis/value");
        LiveServer.Reply reply = server.post(PATH, new ObjectMapper().writeValueAsString(example));
        assertEquals(200, reply.status(), reply.text());
        JsonNode design = reply.json();
        assertEquals(3, design.get("order").asInt());
        assertTrue(design.at("/specMatching/enabled").asBoolean());
        assertEquals(0.3, design.at("/simulated/settlingTime").asDouble(), 0.3e-3);
        assertEquals(1.5, design.at("/simulated/overshootPercent").asDouble(), 0.01);
        assertTrue(design.at("/verification/specsMet").asBoolean(), design.toString());
        assertTrue(design.at("/verification/certified").asBoolean(), design.toString());
        assertTrue(design.at("/verification/peakDisturbanceGain").asDouble()
                <= design.get("gamma").asDouble() * (1 + 1e-8));
        assertTrue(design.at("/riccati/residualNorm").asDouble() < 1e-9);
        assertTrue(design.at("/riccati/numeric/relativeDifference").asDouble() < 1e-6);
    }

    /** n = 2 through both endpoints: the same gamma_min and gains as the closed form of POST /v1/designs. */
    @Test
    void secondOrderAgreesWithTheClosedFormEndpoint() {
        JsonNode closed = server.post(
                        "/v1/designs",
                        "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                                + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}")
                .json();
        JsonNode high = server.post(
                        PATH,
                        "{\"plant\":{\"denominator\":[1,0.48,0],\"b\":400,\"disturbance\":[0,400]},"
                                + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}")
                .json();
        assertEquals(
                closed.get("gammaMin").asDouble(),
                high.get("gammaMin").asDouble(),
                1e-12 * closed.get("gammaMin").asDouble());
        assertEquals(
                closed.at("/gain/k/0").asDouble(),
                high.at("/gain/k/0").asDouble(),
                1e-12 * closed.at("/gain/k/0").asDouble());
        assertEquals(
                closed.at("/gain/k/1").asDouble(),
                high.at("/gain/k/1").asDouble(),
                1e-12 * closed.at("/gain/k/1").asDouble());
        assertEquals(
                closed.at("/riccati/p/0/0").asDouble(),
                high.at("/riccati/p/0/0").asDouble(),
                1e-12 * closed.at("/riccati/p/0/0").asDouble());
        assertEquals(
                closed.at("/weights/1").asDouble(),
                high.at("/weights/1").asDouble(),
                1e-12 * closed.at("/weights/1").asDouble());
    }

    /**
     * Issue 12 item 2 end to end: gamma 9 was refused as "not above gamma_min 11.1542", yet the independent
     * check found rho = [373.38, 711.45, 69.344, 21.700, 2.1429] and a closed-loop norm 8.994 at gamma 9.
     */
    @Test
    void unmatchedDisturbanceAcceptsGammaNine() {
        LiveServer.Reply reply = server.post(
                PATH,
                "{\"plant\":{\"denominator\":[1,7.383026668401097,30.503422892081126,"
                        + "88.57936923160051,143.70716638812533,116.18020871989592],\"b\":9.239987350768951,"
                        + "\"numerator\":[-0.07477891545821842,1.0],\"disturbance\":[-0.011479745058412868,"
                        + "0.005237289926014479,-0.09520698703810945,-0.01578820225853452,-0.03225289088209848]},"
                        + "\"spec\":{\"settlingTime\":1.1425650820161488,\"overshootPercent\":1.8545524264102118,"
                        + "\"settlingBandPercent\":5,\"gamma\":9},\"matchSpecs\":true}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode design = reply.json();
        assertEquals(9, design.get("gamma").asDouble());
        assertEquals(373.38, design.at("/weights/0").asDouble(), 0.01);
        assertEquals(2.1429, design.at("/weights/4").asDouble(), 1e-4);
        assertEquals(8.994, design.at("/verification/peakDisturbanceGain").asDouble(), 1e-3);
        assertTrue(design.at("/verification/certified").asBoolean(), design.toString());
        JsonNode last =
                design.get("gammaIntervals").get(design.get("gammaIntervals").size() - 1);
        assertTrue(last.get("unbounded").asBoolean());
        assertFalse(last.has("upper"), "no number stands for infinity: " + last);
        assertEquals(
                design.get("gammaMin").asDouble(),
                design.at("/gammaIntervals/0/lower").asDouble());
    }

    /**
     * Issue 12 item 4: a requirement fails at gamma = infinity, which the old code took for "no gamma at all";
     * the check found rho = [2.8685, 0.47929, 1.0706, 0.10449, 0.0061446] and norm 284.3 at gamma 300.
     */
    @Test
    void boundedFeasibleSetAcceptsGammaThreeHundred() {
        LiveServer.Reply reply = server.post(
                PATH,
                "{\"plant\":{\"denominator\":[1,35.17298130085375,580.1103571483848,"
                        + "4285.479299120085,10563.774241076499,-4664.394958744662],\"b\":4981.713964800213,"
                        + "\"numerator\":[0.42082210235868306,1.0],\"disturbance\":[-87.57057439775919,222.93044269608208,"
                        + "-920.389020662208,8698.501577157102,-28721.24165932483]},\"spec\":{\"settlingTime\":2.055015615852868,"
                        + "\"overshootPercent\":0.3424922914388982,\"settlingBandPercent\":5,\"gamma\":300},"
                        + "\"auxiliaryPoles\":{\"poles\":[{\"re\":-15.945617686966436,\"im\":0},{\"re\":-21.564618342946243,"
                        + "\"im\":0},{\"re\":-17.05786188395355,\"im\":0}]}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode design = reply.json();
        assertEquals(2.8685, design.at("/weights/0").asDouble(), 1e-4);
        assertEquals(0.0061446, design.at("/weights/4").asDouble(), 1e-7);
        assertEquals(284.3, design.at("/verification/peakDisturbanceGain").asDouble(), 0.1);
        assertTrue(design.at("/verification/certified").asBoolean(), design.toString());
        JsonNode only = design.at("/gammaIntervals/0");
        assertFalse(only.get("unbounded").asBoolean());
        assertTrue(only.get("lower").asDouble() < 300 && only.get("upper").asDouble() > 300, only.toString());
        assertEquals("weightReal", only.at("/upperBinding/condition").asText());
    }

    /** Issue 12 item 3: 1.001 x the old gamma_min 892911.6 is outside the feasible set: 422 at /spec/gamma. */
    @Test
    void gammaOutsideTheFeasibleSetIsA422NamingTheIntervals() {
        LiveServer.Reply reply = server.post(
                PATH,
                "{\"plant\":{\"denominator\":[1,8.882909324515014,38.52871463226239,123.65431526377886,"
                        + "169.3013746965912,134.5277526057287,24.97941139170825,0.0],"
                        + "\"b\":0.04324120581504016,\"disturbance\":[7.7270514615083,-4.699242623990899,6.92906458125667,"
                        + "1.7780545876755274,-1.5050091596285124,-4.120016176140748,5.0987200947974]},"
                        + "\"spec\":{\"settlingTime\":4.27809291643725,\"overshootPercent\":5.483595520321292,"
                        + "\"gamma\":893804.5},\"matchSpecs\":true}");
        assertEquals(422, reply.status(), reply.text());
        assertEquals("/spec/gamma", reply.json().at("/errors/0/pointer").asText());
        assertTrue(reply.json().get("detail").asText().contains("outside the feasible gamma set ("), reply.text());
        assertTrue(reply.json().get("detail").asText().contains("infinity)"), reply.text());
    }

    /** A zero at +2 1/s with 0.5 s settling forces 57% undershoot (bound (1 - delta)/(e^{z ts} - 1), from memory). */
    @Test
    void rightHalfPlaneZeroIsA422NamingTheSettlingTime() {
        LiveServer.Reply reply = server.post(
                PATH,
                "{\"plant\":{\"denominator\":[1,0,3,2],\"numerator\":[-0.5,1],"
                        + "\"b\":5,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":0.5,\"overshootPercent\":2},"
                        + "\"matchSpecs\":true}");
        assertEquals(422, reply.status(), reply.text());
        assertEquals("/spec/settlingTime", reply.json().at("/errors/0/pointer").asText());
        assertTrue(reply.json().get("detail").asText().contains("right-half-plane zero"), reply.text());
        assertEquals(
                "/spec/settlingTime", reply.json().at("/proposals/0/pointer").asText());
    }

    @Test
    void unreachableSpecReportsNonConvergenceAsA422() {
        LiveServer.Reply reply = server.post(
                PATH,
                "{\"plant\":{\"denominator\":[1,0,3,2],\"numerator\":[5,1],"
                        + "\"b\":5,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":2},"
                        + "\"matchSpecs\":true}");
        assertEquals(422, reply.status(), reply.text());
        assertTrue(reply.json().get("detail").asText().contains("did not converge"), reply.text());
    }

    @ParameterizedTest
    @CsvSource(
            delimiter = '|',
            value = {
                "{\"plant\":{\"denominator\":[1,9,8,7,6,5,4,3,2,1],\"b\":1,\"disturbance\":[1,1,1,1,1,1,1,1,1]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}}|/plant/denominator",
                "{\"plant\":{\"denominator\":[1,3,2,1],\"b\":1,\"disturbance\":[0,1]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}}|/plant/disturbance",
                "{\"plant\":{\"denominator\":[1,3,2,1],\"b\":1,\"disturbance\":[0,0,0]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}}|/plant/disturbance",
                "{\"plant\":{\"denominator\":[1,3,2,1],\"numerator\":[1,0],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}}|/plant/numerator/1",
                "{\"plant\":{\"denominator\":[1,4,3,2,1],\"b\":1,\"disturbance\":[0,0,0,1]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2},\"auxiliaryPoles\":{\"poles\":[{\"re\":-5,\"im\":1},{\"re\":-5,\"im\":2}]}}|/auxiliaryPoles/poles/0/im",
                "{\"plant\":{\"denominator\":[1,4,3,2,1],\"b\":1,\"disturbance\":[0,0,0,1]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2},\"auxiliaryPoles\":{\"poles\":[{\"re\":-5,\"im\":0}]}}|/auxiliaryPoles/poles",
                "{\"plant\":{\"denominator\":[1,4,3,2,1],\"b\":1,\"disturbance\":[0,0,0,1]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2},\"auxiliaryPoles\":{\"poles\":[{\"re\":5,\"im\":0},{\"re\":-5,\"im\":0}]}}|/auxiliaryPoles/poles/0/re",
                "{\"plant\":{\"denominator\":[1,3,2,1],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2},\"auxiliaryPoles\":{\"realPartMultiple\":0.5}}|/auxiliaryPoles/realPartMultiple",
                "{\"plant\":{\"denominator\":[1,3,2,1],\"b\":1,\"disturbance\":[0,0,1]},\"spec\":{\"overshootPercent\":2}}|/spec/settlingTime",
            })
    void badInputIsA400NamingTheField(String body, String pointer) {
        LiveServer.Reply reply = server.post(PATH, body);
        assertEquals(400, reply.status(), reply.text());
        assertEquals(pointer, reply.json().at("/errors/0/pointer").asText(), reply.text());
    }

    @Test
    void unknownFieldsAndNaNAreRejected() {
        assertEquals(
                400,
                server.post(
                                PATH,
                                "{\"plant\":{\"denominator\":[1,2,1],\"b\":1,\"disturbance\":[0,1],"
                                        + "\"a0\":1},\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}}")
                        .status());
        assertEquals(
                400,
                server.post(
                                PATH,
                                "{\"plant\":{\"denominator\":[1,2,NaN],\"b\":1,\"disturbance\":[0,1]},"
                                        + "\"spec\":{\"settlingTime\":1,\"overshootPercent\":2}}")
                        .status());
        assertEquals(415, server.post(PATH, "{}", "text/plain").status());
    }

    /**
     * The same pick-and-place axis as a physical state space x = [position, velocity, torque-producing current]:
     * q' = v, v' = -0.48 v + 400 i (+ 400 w), i' = -200 i + 200 u. Its companion form has the same denominator
     * (the characteristic polynomial is similarity-invariant) and the returned plantGain places the same poles
     * on the physical state (EJML eigenvalues of A - b2 plantGain, checked here against the requested polynomial
     * through the companion closed loop, which has the same characteristic polynomial).
     */
    @Test
    void stateSpaceInputIsTransformedAndTheGainActsOnThePhysicalState() {
        LiveServer.Reply reply = server.post(
                PATH,
                "{\"plant\":{\"stateSpace\":{\"a\":[[0,1,0],[0,-0.48,400],"
                        + "[0,0,-200]],\"b2\":[0,0,200],\"b1\":[0,400,0]}},\"spec\":{\"settlingTime\":0.3,"
                        + "\"overshootPercent\":1.5},\"auxiliaryPoles\":{\"poles\":[{\"re\":-250,\"im\":0}]}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode design = reply.json();
        assertEquals("stateSpace", design.at("/coordinates/frame").asText());
        // highest power first: s^3 + 200.48 s^2 + 96 s + 0
        assertEquals(1, design.at("/coordinates/denominator/0").asDouble(), 0);
        assertEquals(200.48, design.at("/coordinates/denominator/1").asDouble(), 1e-9);
        assertEquals(96, design.at("/coordinates/denominator/2").asDouble(), 1e-9);
        assertEquals(0, design.at("/coordinates/denominator/3").asDouble(), 1e-9);
        // closed loop A - b2 plantGain on x: its characteristic polynomial is the requested one
        double[][] a = {{0, 1, 0}, {0, -0.48, 400}, {0, 0, -200}};
        for (int j = 0; j < 3; j++) {
            a[2][j] -= 200 * design.at("/coordinates/plantGain/" + j).asDouble();
        }
        // det(sI - A) = s^3 - tr(A) s^2 + (sum of principal 2x2 minors) s - det(A)
        double trace = a[0][0] + a[1][1] + a[2][2];
        double minors = a[0][0] * a[1][1]
                - a[0][1] * a[1][0]
                + a[0][0] * a[2][2]
                - a[0][2] * a[2][0]
                + a[1][1] * a[2][2]
                - a[1][2] * a[2][1];
        double det = a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1])
                - a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0])
                + a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0]);
        // highest power first: [1, alpha_2, alpha_1, alpha_0]
        JsonNode polynomial = design.at("/target/characteristicPolynomial");
        assertEquals(1, polynomial.get(0).asDouble(), 0);
        assertEquals(
                polynomial.get(1).asDouble(), -trace, 1e-9 * polynomial.get(1).asDouble());
        assertEquals(
                polynomial.get(2).asDouble(), minors, 1e-9 * polynomial.get(2).asDouble());
        assertEquals(
                polynomial.get(3).asDouble(), -det, 1e-9 * polynomial.get(3).asDouble());
        assertTrue(design.at("/verification/certified").asBoolean(), design.toString());
    }

    @Test
    void uncontrollableStateSpaceIsA422NamingB2() {
        LiveServer.Reply reply = server.post(
                PATH,
                "{\"plant\":{\"stateSpace\":{\"a\":[[-1,0,0],[0,-2,0],"
                        + "[0,0,-3]],\"b2\":[1,1,0],\"b1\":[0,0,1]}},\"spec\":{\"settlingTime\":1,"
                        + "\"overshootPercent\":2}}");
        assertEquals(422, reply.status(), reply.text());
        assertEquals(
                "/plant/stateSpace/b2", reply.json().at("/errors/0/pointer").asText());
    }
}
