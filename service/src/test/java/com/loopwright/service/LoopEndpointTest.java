package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.*;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Integral action and position-only sensing end to end (issue 16), on the real server; LiveServer validates every
 * reply against openapi.yaml.
 */
class LoopEndpointTest extends LiveServerTest {

    /** A vertical axis as a mass (18 kg carriage and load, 60 N s/m of viscous friction, no spring), force command. */
    private static final String VERTICAL_AXIS =
            "\"plant\":{\"form\":\"massSpringDamper\",\"mass\":18,\"damping\":60,\"stiffness\":0}";

    private static final String SPEC = "\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":2}";
    /** The carriage's weight, 18 kg x 9.80665 m/s^2, against the axis. */
    private static final double GRAVITY_LOAD = -18 * 9.80665;

    private static final String ENCODER_ONLY = "\"measurement\":\"position\",\"observer\":{\"method\":\"kalman\","
            + "\"processNoise\":25,\"sensorResolution\":1e-6,\"samplePeriod\":1e-3}";

    private static JsonNode design(String body) {
        LiveServer.Reply reply = server.post("/v1/designs", body);
        assertEquals(200, reply.status(), reply.text());
        return reply.json();
    }

    /** Issue 16: settling within 0.5 % and overshoot within 0.02 points of the plain design's simulated step. */
    private static void assertSameStep(JsonNode plain, JsonNode step, String where) {
        double settling = plain.at("/simulated/settlingTime").asDouble();
        assertEquals(settling, step.get("settlingTime").asDouble(), 0.005 * settling, where);
        assertEquals(
                plain.at("/simulated/overshootPercent").asDouble(),
                step.get("overshootPercent").asDouble(),
                0.02,
                where);
    }

    private static List<String> texts(JsonNode array) {
        List<String> list = new ArrayList<>();
        array.forEach(n -> list.add(n.asText()));
        return list;
    }

    @Test
    void verticalAxisWithIntegralActionAndEncoderOnlyKeepsThePlainStepAndHoldsTheLoad() {
        JsonNode plain = design("{" + VERTICAL_AXIS + "," + SPEC + "}");
        JsonNode loop = design("{" + VERTICAL_AXIS + "," + SPEC + ",\"integralAction\":true," + ENCODER_ONLY
                + ",\"loadStepSize\":" + GRAVITY_LOAD + "}");
        // existing sections are the plain design's, unchanged
        assertEquals(plain.get("gain"), loop.get("gain"));
        assertEquals(plain.get("simulated"), loop.get("simulated"));
        assertNull(plain.get("law"));
        assertSameStep(plain, loop.at("/law/step"), "state-feedback loop with integral action");
        assertSameStep(plain, loop.at("/outputFeedback/step"), "full loop with the observer");
        assertTrue(loop.at("/outputFeedback/specsMet").asBoolean());
        assertTrue(loop.at("/outputFeedback/largestStepDifference").asDouble() < 1e-6);
        // the certificate is the state-feedback loop's; the full loop's norm is stated plainly against gamma
        assertTrue(loop.at("/law/certified").asBoolean());
        assertTrue(loop.at("/law/peakDisturbanceGain").asDouble()
                <= loop.at("/law/gamma").asDouble() * (1 + 1e-9));
        boolean exceeds = loop.at("/outputFeedback/peakDisturbanceGain").asDouble()
                > loop.at("/outputFeedback/gamma").asDouble();
        assertEquals(exceeds, loop.at("/outputFeedback/exceedsGamma").asBoolean());
        List<String> codes = texts(loop.get("noteCodes"));
        assertTrue(codes.contains(exceeds ? "observerNormExceedsGamma" : "observerNormNotCertified"), codes.toString());
        assertTrue(codes.containsAll(List.of("integralAction", "lawSupersedesGain", "observerDesign")));
        assertEquals(texts(loop.get("notes")).size(), codes.size());
        // the integral pole at 4 x the dominant real part, cancelled by the feedforward zero: kr = ki / (-p_i)
        double dominant = loop.at("/target/dominantPoles/0/re").asDouble();
        assertEquals(4 * dominant, loop.at("/law/integralPole").asDouble(), 1e-9 * Math.abs(dominant));
        assertEquals(
                loop.at("/law/integralGain").asDouble()
                        / -loop.at("/law/integralPole").asDouble(),
                loop.at("/law/referenceGain").asDouble(),
                1e-9 * loop.at("/law/referenceGain").asDouble());
        // the quantization noise Delta^2 T / 12 (common practice)
        assertEquals(1e-12 * 1e-3 / 12, loop.at("/observer/measurementNoise").asDouble(), 1e-30);
        assertEquals("kalman", loop.at("/observer/method").asText());
        // the load: no steady offset, the simulated output back to ~0 after the peak
        JsonNode load = loop.get("loadStep");
        assertTrue(load.get("zeroSteadyOffset").asBoolean());
        assertEquals(GRAVITY_LOAD, load.get("loadStepSize").asDouble(), 0);
        assertTrue(Math.abs(load.get("steadyOffset").asDouble())
                < 1e-12 * load.get("peakDeviation").asDouble());
        assertTrue(Math.abs(load.get("simulatedFinalOutput").asDouble())
                < 1e-3 * load.get("peakDeviation").asDouble());
        assertTrue(load.get("recoveryTime").asDouble() > load.get("peakTime").asDouble());
        // margins: the unbounded gain margin is stated by its flag
        for (String margins : List.of("/law/margins", "/outputFeedback/margins")) {
            JsonNode m = loop.at(margins);
            assertEquals(m.has("gainMargin"), !m.get("gainMarginUnbounded").asBoolean(), margins);
            assertTrue(m.get("closedLoopStable").asBoolean(), margins);
            assertTrue(m.get("phaseMargin").asDouble() > 30, margins);
        }
    }

    /**
     * The gains against the poles they claim, by the characteristic polynomials of the companion forms (textbook
     * state-space algebra, from memory): with z = [-xi, x1, x2] and r = 0 the state-feedback loop has
     * s^3 + (a1 + b k2) s^2 + (a0 + b k1) s + b ki; the estimation error e' = (A - L C) e has s^2 + (a1 + l1) s +
     * (a0 + a1 l1 + l2).
     */
    @Test
    void lawAndObserverGainsPlaceThePolesTheyReport() {
        JsonNode loop = design("{" + VERTICAL_AXIS + "," + SPEC + ",\"integralAction\":true," + ENCODER_ONLY + "}");
        double a0 = loop.at("/plant/a0").asDouble();
        double a1 = loop.at("/plant/a1").asDouble();
        double b = loop.at("/plant/b").asDouble();
        double k1 = loop.at("/law/k/0").asDouble();
        double k2 = loop.at("/law/k/1").asDouble();
        double ki = loop.at("/law/integralGain").asDouble();
        double[] law = monic(loop.at("/law/closedLoopPoles"));
        assertEquals(a1 + b * k2, law[1], 1e-9 * law[1]);
        assertEquals(a0 + b * k1, law[2], 1e-9 * law[2]);
        assertEquals(b * ki, law[3], 1e-9 * law[3]);
        double l1 = loop.at("/observer/gain/0").asDouble();
        double l2 = loop.at("/observer/gain/1").asDouble();
        double[] observer = monic(loop.at("/observer/poles"));
        assertEquals(a1 + l1, observer[1], 1e-9 * observer[1]);
        assertEquals(a0 + a1 * l1 + l2, observer[2], 1e-9 * observer[2]);
    }

    /** Coefficients of prod (s - p_i), highest power first, from poles given as re/im (conjugates included). */
    private static double[] monic(JsonNode poles) {
        double[] re = new double[poles.size() + 1];
        double[] im = new double[poles.size() + 1];
        re[0] = 1;
        for (int k = 0; k < poles.size(); k++) {
            double pr = poles.get(k).get("re").asDouble();
            double pi = poles.get(k).get("im").asDouble();
            for (int j = k + 1; j >= 1; j--) {
                // c_j <- c_j - p c_{j-1}
                double nr = re[j] - (pr * re[j - 1] - pi * im[j - 1]);
                double ni = im[j] - (pr * im[j - 1] + pi * re[j - 1]);
                re[j] = nr;
                im[j] = ni;
            }
        }
        return re;
    }

    /** The README's worked example (vertical axis, encoder only): the request as printed, the numbers it quotes. */
    @Test
    void readmeVerticalAxisExamplePrintsTheQuotedNumbers() throws Exception {
        String readme = java.nio.file.Files.readString(java.nio.file.Path.of("..", "README.md"));
        int section = readme.indexOf("## The loop as it runs");
        java.util.regex.Matcher body =
                java.util.regex.Pattern.compile("(?s)<<'JSON'\\n(.*?)\\nJSON").matcher(readme.substring(section));
        assertTrue(body.find(), "the README section has its request");
        JsonNode loop = design(body.group(1));
        // the contract carries the same request as an example
        JsonNode example = Contract.load()
                .document()
                .at("/paths/~1v1~1designs/post/requestBody/content/application~1json/examples"
                        + "/verticalAxisEncoderOnly/value");
        assertEquals(new com.fasterxml.jackson.databind.ObjectMapper().readTree(body.group(1)), example);
        assertEquals(15219, loop.at("/law/k/0").asDouble(), 0.5);
        assertEquals(97209, loop.at("/law/integralGain").asDouble(), 0.5);
        assertEquals(-37.45, loop.at("/law/integralPole").asDouble(), 0.005);
        assertEquals(1.663, loop.at("/law/gamma").asDouble(), 0.0005);
        assertEquals(1.367, loop.at("/outputFeedback/peakDisturbanceGain").asDouble(), 0.0005);
        assertEquals(3.72e6, loop.at("/outputFeedback/noiseToCommandGain").asDouble(), 0.005e6);
        assertEquals(0.00897, loop.at("/loadStep/peakDeviation").asDouble(), 0.000005);
        assertEquals(0.425, loop.at("/loadStep/recoveryTime").asDouble(), 0.0005);
        assertTrue(texts(loop.get("noteCodes")).contains("observerFasterThanSampling"));
        assertTrue(readme.substring(section).contains("8.97 mm at 0.121 s, recovered at 0.425 s"));
    }

    /**
     * Position-only sensing without integral action: the load leaves the offset of the final-value theorem. By hand
     * for the canonical plant (final-value theorem, Ogata, Modern Control Engineering, from memory): at rest the
     * estimation error is e = -(A - L C)^-1 B1 w0 = [d w0, l1 d w0] / (l1 a1 + a0 + l2), and the plant row gives
     * x1 = (d w0 + b (k1 e1 + k2 e2)) / (a0 + b k1); with full-state sensing e = 0 and x1 = d w0 / (a0 + b k1).
     */
    @Test
    void positionOnlyLoadOffsetIsTheFinalValueTheoremByHand() {
        JsonNode loop = design("{\"plant\":{\"form\":\"canonical\",\"a0\":4,\"a1\":2.5,\"b\":3,\"d\":0.5},"
                + "\"spec\":{\"settlingTime\":0.8,\"overshootPercent\":3},\"measurement\":\"position\","
                + "\"observer\":{\"method\":\"poleMultiple\",\"multiple\":6},\"loadStepSize\":2}");
        double a0 = 4, a1 = 2.5, b = 3, d = 0.5, w0 = 2;
        double k1 = loop.at("/law/k/0").asDouble();
        double k2 = loop.at("/law/k/1").asDouble();
        double l1 = loop.at("/observer/gain/0").asDouble();
        double l2 = loop.at("/observer/gain/1").asDouble();
        double det = l1 * a1 + a0 + l2;
        double e1 = d * w0 / det;
        double e2 = l1 * d * w0 / det;
        double offset = (d * w0 + b * (k1 * e1 + k2 * e2)) / (a0 + b * k1);
        JsonNode load = loop.get("loadStep");
        assertFalse(load.get("zeroSteadyOffset").asBoolean());
        assertEquals(offset, load.get("steadyOffset").asDouble(), 1e-9 * Math.abs(offset));
        assertEquals(offset, load.get("simulatedFinalOutput").asDouble(), 1e-4 * Math.abs(offset));
        assertNotEquals(d * w0 / (a0 + b * k1), offset, 1e-6 * Math.abs(offset), "the observer changes the offset");
        assertFalse(loop.at("/law").has("integralGain"));
        assertEquals("poleMultiple", loop.at("/observer/method").asText());
        assertEquals(6, loop.at("/observer/multiple").asDouble(), 0);
        // the error poles at 6 x the controller's: |p_obs| = 6 wn
        double wn = loop.at("/target/naturalFrequency").asDouble();
        JsonNode p = loop.at("/observer/poles/0");
        assertEquals(6 * wn, Math.hypot(p.get("re").asDouble(), p.get("im").asDouble()), 1e-6 * wn);
    }

    @Test
    void integralActionAloneHasNoObserverSectionsAndNoOffset() {
        JsonNode plain = design("{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}");
        JsonNode loop = design("{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5},\"integralAction\":true,"
                + "\"integralPoleMultiple\":6}");
        assertNull(loop.get("observer"));
        assertNull(loop.get("outputFeedback"));
        assertSameStep(plain, loop.at("/law/step"), "integral action, full state");
        assertEquals(3, loop.at("/law/weights").size(), "rho on -xi, x1, x2");
        assertEquals(
                6 * loop.at("/target/dominantPoles/0/re").asDouble(),
                loop.at("/law/integralPole").asDouble(),
                1e-9);
        assertTrue(loop.at("/loadStep/zeroSteadyOffset").asBoolean());
    }

    /** Order n: the output row says what is measured; the step is the matched plain design's. */
    @Test
    void orderThreeWithIntegralActionAndOutputOnlyKeepsTheMatchedStep() {
        String plant = "\"plant\":{\"denominator\":[1,3,2.5,0],\"b\":40,\"disturbance\":[0,0,40]},"
                + "\"spec\":{\"settlingTime\":0.5,\"overshootPercent\":2}";
        LiveServer.Reply plainReply = server.post("/v1/designs/high-order", "{" + plant + ",\"matchSpecs\":true}");
        assertEquals(200, plainReply.status(), plainReply.text());
        LiveServer.Reply reply = server.post(
                "/v1/designs/high-order",
                "{" + plant + ",\"matchSpecs\":true,\"integralAction\":true,\"measurement\":\"position\"}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode plain = plainReply.json();
        JsonNode loop = reply.json();
        assertSameStep(plain, loop.at("/law/step"), "order 3, integral action");
        assertSameStep(plain, loop.at("/outputFeedback/step"), "order 3, with the observer");
        assertEquals(3, loop.at("/law/k").size());
        assertEquals(3, loop.at("/observer/gain").size());
        assertTrue(loop.at("/loadStep/zeroSteadyOffset").asBoolean());
    }

    /** 10 % overshoot is outside what integral action on this axis can certify: 422 with a computed proposal. */
    @Test
    void infeasibleAugmentedDesignIsA422WithAProposalThatDesigns() throws Exception {
        String plant = "\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":2.5,\"b\":3.3333333333333335,"
                + "\"d\":0.08333333333333333}";
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + plant + ",\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":10},\"integralAction\":true}");
        assertEquals(422, reply.status(), reply.text());
        JsonNode proposal = reply.json().at("/proposals/0");
        assertEquals("/spec/overshootPercent", proposal.get("pointer").asText(), reply.text());
        double overshoot = proposal.get("value").asDouble();
        JsonNode accepted = design("{" + plant + ",\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":" + overshoot
                + "},\"integralAction\":true}");
        assertTrue(accepted.at("/law/certified").asBoolean());
    }

    @Test
    void aPlantWithoutDisturbanceInputIsA422AtD() {
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":2.5,\"b\":3,\"d\":0},"
                        + "\"spec\":{\"settlingTime\":0.4,\"overshootPercent\":2},\"integralAction\":true}");
        assertEquals(422, reply.status(), reply.text());
        assertEquals("/plant/d", reply.json().at("/errors/0/pointer").asText(), reply.text());
    }

    @Test
    void badLoopFieldsAre400WithTheirPointers() {
        LiveServer.Reply reply = server.post(
                "/v1/designs",
                "{" + VERTICAL_AXIS + "," + SPEC + ",\"measurement\":\"velocity\",\"integralPoleMultiple\":40}");
        assertEquals(400, reply.status(), reply.text());
        List<String> pointers = new ArrayList<>();
        reply.json().get("errors").forEach(e -> pointers.add(e.get("pointer").asText()));
        assertTrue(pointers.containsAll(List.of("/measurement", "/integralPoleMultiple")), pointers.toString());
        LiveServer.Reply highOrder = server.post(
                "/v1/designs/high-order",
                "{\"plant\":{\"denominator\":[1,3,2.5,0],\"b\":40,\"disturbance\":[0,0,40]},"
                        + "\"spec\":{\"settlingTime\":0.5,\"overshootPercent\":2},\"measurement\":\"position\","
                        + "\"observer\":{\"method\":\"kalman\",\"processNoise\":1}}");
        assertEquals(400, highOrder.status(), highOrder.text());
        assertEquals(
                "/observer/measurementNoise",
                highOrder.json().at("/errors/0/pointer").asText());
    }

    /**
     * The design's law and observer gain, sent back to POST /v1/verifications, give the same loop: the same step,
     * load step, margins and noise-to-command gain (two independent assemblies of the same matrices would agree).
     */
    @Test
    void verificationOfTheDesignedLawReproducesTheDesignsLoopFigures() {
        String coefficients = "\"a0\":0,\"a1\":3.3333333333333335,\"b\":0.05555555555555555,\"d\":0.05555555555555555}";
        // the verification's plant is always canonical, and names its form as every plant does
        String plant = "\"plant\":{\"form\":\"canonical\"," + coefficients;
        JsonNode loop = design("{\"plant\":{\"form\":\"canonical\"," + coefficients + "," + SPEC
                + ",\"integralAction\":true,\"measurement\":\"position\"," + "\"loadStepSize\":-100}");
        JsonNode law = loop.get("law");
        String body = "{" + plant + ",\"gain\":{\"k1\":" + law.at("/k/0") + ",\"k2\":" + law.at("/k/1")
                + ",\"referenceGain\":" + law.get("referenceGain") + ",\"integralGain\":" + law.get("integralGain")
                + "},\"spec\":{\"settlingTime\":0.3,\"overshootPercent\":2},\"measurement\":\"position\","
                + "\"observerGain\":" + loop.at("/observer/gain") + ",\"loadStepSize\":-100}";
        LiveServer.Reply reply = server.post("/v1/verifications", body);
        assertEquals(200, reply.status(), reply.text());
        JsonNode check = reply.json().get("loop");
        JsonNode full = loop.get("outputFeedback");
        assertEquals(
                full.at("/step/settlingTime").asDouble(),
                check.at("/step/settlingTime").asDouble(),
                1e-9);
        assertEquals(
                full.at("/step/overshootPercent").asDouble(),
                check.at("/step/overshootPercent").asDouble(),
                1e-9);
        assertEquals(
                full.get("noiseToCommandGain").asDouble(),
                check.get("noiseToCommandGain").asDouble(),
                1e-6 * full.get("noiseToCommandGain").asDouble());
        assertEquals(
                full.at("/margins/phaseMargin").asDouble(),
                check.at("/margins/phaseMargin").asDouble(),
                1e-6);
        assertEquals(
                loop.at("/loadStep/peakDeviation").asDouble(),
                check.at("/loadStep/peakDeviation").asDouble(),
                1e-9 * loop.at("/loadStep/peakDeviation").asDouble());
        assertTrue(check.at("/loadStep/zeroSteadyOffset").asBoolean());
        assertEquals("x1", check.get("performanceOutput").asText());
        // a request without the loop fields has no loop section
        LiveServer.Reply plainCheck = server.post(
                "/v1/verifications",
                "{" + plant + ",\"gain\":{\"k1\":" + law.at("/k/0") + ",\"k2\":" + law.at("/k/1")
                        + ",\"referenceGain\":1}}");
        assertEquals(200, plainCheck.status(), plainCheck.text());
        assertNull(plainCheck.json().get("loop"));
    }

    @Test
    void verificationDesignsAKalmanObserverWhenAsked() {
        LiveServer.Reply reply = server.post(
                "/v1/verifications",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"gain\":{\"k1\":1.5,\"k2\":0.05,"
                        + "\"referenceGain\":1.5},\"measurement\":\"position\",\"observer\":{\"method\":\"kalman\","
                        + "\"processNoise\":1,\"measurementNoise\":1e-8},\"performance\":{\"rho1\":1,\"rho2\":0,"
                        + "\"gamma\":2}}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode check = reply.json().get("loop");
        assertEquals("kalman", check.at("/observer/method").asText());
        assertEquals(check.at("/observer/gain"), check.get("observerGain"));
        assertEquals(
                check.get("peakDisturbanceGain").asDouble() > 2,
                check.get("exceedsGamma").asBoolean());
        assertFalse(check.at("/loadStep/zeroSteadyOffset").asBoolean());
        LiveServer.Reply refused = server.post(
                "/v1/verifications",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"gain\":{\"k1\":1.5,\"k2\":0.05,"
                        + "\"referenceGain\":1.5},\"measurement\":\"position\",\"observer\":{\"method\":"
                        + "\"poleMultiple\"}}");
        assertEquals(400, refused.status(), refused.text());
        assertEquals("/observer/method", refused.json().at("/errors/0/pointer").asText());
    }
}
