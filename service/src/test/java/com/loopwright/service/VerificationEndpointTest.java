package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The verify section of POST /v1/designs and POST /v1/verifications on the live server; LiveServer checks every
 * response against openapi.yaml.
 */
class VerificationEndpointTest extends LiveServerTest {

    private static final String AXIS = "\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}";
    private static final String GAINS = "\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"gain\":{\"k1\":1.5723,\"k2\":0.0992069,\"referenceGain\":1.5723}";

    @Test
    void designWithoutVerifyHasNoRobustnessMember() {
        LiveServer.Reply reply = server.post("/v1/designs", "{" + AXIS + "}");
        assertEquals(200, reply.status());
        assertFalse(reply.json().has("robustness"));
    }

    @Test
    void designWithEveryCheckReportsVerdicts() {
        String verify =
                "\"verify\":{\"uncertainty\":{\"a1\":{\"spreadPercent\":20},\"b\":{\"lowest\":380,\"highest\":420},"
                        + "\"monteCarloSamples\":40,\"seed\":9},"
                        + "\"disturbances\":[{\"shape\":\"step\",\"amplitude\":0.05,\"start\":0.01},"
                        + "{\"shape\":\"pulse\",\"amplitude\":0.1,\"start\":0.01,\"duration\":0.02},"
                        + "{\"shape\":\"sinusoid\",\"amplitude\":0.02,\"frequency\":30},"
                        + "{\"shape\":\"randomBounded\",\"amplitude\":0.05,\"holdTime\":0.005,\"seed\":4}],"
                        + "\"actuatorLimit\":1.2,\"sampling\":{\"samplePeriod\":0.001,\"findLongest\":true},"
                        + "\"inputDelay\":0.0025,\"frequencyPoints\":40,\"timeSeriesPoints\":50}";
        LiveServer.Reply reply = server.post("/v1/designs", "{" + AXIS + "," + verify + "}");
        assertEquals(200, reply.status(), reply.text());
        JsonNode r = reply.json().get("robustness");
        assertTrue(r.get("nominalMeetsSpec").asBoolean());
        assertEquals(4, r.at("/uncertainty/cornerCount").asInt());
        double norm = r.at("/disturbanceChannel/peakDisturbanceGain").asDouble();
        assertTrue(norm <= reply.json().get("gamma").asDouble());
        for (JsonNode d : r.get("disturbances")) {
            assertTrue(d.get("observedGain").asDouble() <= norm, d.toString());
            assertTrue(d.get("withinGamma").asBoolean());
        }
        // kr = 1.5723 > 1.2: the unit step saturates, and the largest unsaturated step is 1.2 / 1.5723
        assertTrue(r.at("/saturation/saturates").asBoolean());
        assertEquals(
                1.2 / reply.json().at("/gain/referenceGain").asDouble(),
                r.at("/saturation/largestUnsaturatedStep").asDouble(),
                1e-9);
        assertTrue(r.at("/sampled/longestSamplePeriod").asDouble() > 0.001);
        assertEquals(
                r.at("/margins/delayMargin").asDouble(),
                r.at("/delay/delayMargin").asDouble(),
                0);
        assertEquals(40, r.at("/margins/response").size());
        assertEquals(4 + 4, r.get("timeSeries").size());
        assertEquals(50, r.at("/timeSeries/0/points").size());
        assertEquals(7, r.get("checks").size());
    }

    @Test
    void theContractExampleVerifiesAndTheSameSeedGivesTheSameBody() throws Exception {
        JsonNode example = server.contract()
                .document()
                .at("/paths/~1v1~1verifications/post/requestBody/content"
                        + "/application~1json/examples/conveyorWithDelay/value");
        String body = new ObjectMapper().writeValueAsString(example);
        LiveServer.Reply first = server.post("/v1/verifications", body);
        LiveServer.Reply second = server.post("/v1/verifications", body);
        assertEquals(200, first.status(), first.text());
        assertEquals(first.text(), second.text(), "bit-for-bit reproducible");
        assertEquals(
                "x1",
                first.json()
                        .at("/robustness/disturbanceChannel/performanceOutput")
                        .asText());
    }

    /**
     * The gain margin on the wire: stated unbounded (and no gainMargin member) for the indexing axis under state
     * feedback, whose loop b (k1 + k2 s)/(s^2 + a1 s) never reaches -180 deg (relative degree 1); finite for
     * a0 = 1, a1 = 3, b = 1, k1 = 1, k2 = -1, where L(2j) = -1/3 by hand and Routh-Hurwitz puts the stability
     * boundary of s^2 + (3 - g) s + (1 + g) at a gain factor g = 3.
     */
    @Test
    void gainMarginIsStatedUnboundedOrGivenFinite() {
        JsonNode unbounded = server.post("/v1/verifications", "{" + GAINS + "}").json();
        assertTrue(unbounded.at("/robustness/margins/gainMarginUnbounded").asBoolean(), unbounded.toString());
        assertTrue(unbounded.at("/robustness/margins/gainMargin").isMissingNode());

        LiveServer.Reply finite = server.post(
                "/v1/verifications",
                "{\"plant\":{\"form\":\"canonical\",\"a0\":1,\"a1\":3,\"b\":1,\"d\":1},"
                        + "\"gain\":{\"k1\":1,\"k2\":-1,\"referenceGain\":2}}");
        assertEquals(200, finite.status(), finite.text());
        JsonNode margins = finite.json().at("/robustness/margins");
        assertFalse(margins.get("gainMarginUnbounded").asBoolean(), margins.toString());
        assertEquals(3, margins.get("gainMargin").asDouble(), 1e-12);
    }

    /** A verification answer carries the four cautions of a design answer, word for word and in order. */
    @Test
    void verificationCarriesTheDesignCautions() {
        LiveServer.Reply verified = server.post("/v1/verifications", "{" + GAINS + "}");
        LiveServer.Reply designed = server.post("/v1/designs", "{" + AXIS + "}");
        assertEquals(200, verified.status(), verified.text());
        assertEquals(200, designed.status(), designed.text());
        assertEquals(4, verified.json().get("cautions").size());
        assertEquals(designed.json().get("cautions"), verified.json().get("cautions"));
    }

    @Test
    void verificationWithoutSpecReportsNoVerdicts() {
        LiveServer.Reply reply = server.post("/v1/verifications", "{" + GAINS + "}");
        assertEquals(200, reply.status(), reply.text());
        assertEquals(0, reply.json().at("/robustness/checks").size());
        assertTrue(reply.json().at("/robustness/margins/phaseMargin").asDouble() > 60);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(
            delimiter = '|',
            quoteCharacter = '`',
            value = {
                "Monte Carlo over cap     | {" + GAINS
                        + ",\"verify\":{\"uncertainty\":{\"monteCarloSamples\":2001}}} | 400 | /verify/uncertainty/monteCarloSamples",
                "frequency points over cap| {" + GAINS
                        + ",\"verify\":{\"frequencyPoints\":501}}                   | 400 | /verify/frequencyPoints",
                "series points over cap   | {" + GAINS
                        + ",\"verify\":{\"timeSeriesPoints\":1001}}                 | 400 | /verify/timeSeriesPoints",
                "b range through zero     | {" + GAINS
                        + ",\"verify\":{\"uncertainty\":{\"b\":{\"lowest\":-1,\"highest\":500}}}} | 400 | /verify/uncertainty/b",
                "both range forms         | {" + GAINS
                        + ",\"verify\":{\"uncertainty\":{\"a1\":{\"spreadPercent\":5,\"lowest\":0}}}} | 400 | /verify/uncertainty/a1",
                "unknown shape            | {" + GAINS
                        + ",\"verify\":{\"disturbances\":[{\"shape\":\"chirp\",\"amplitude\":1}]}} | 400 | /verify/disturbances/0/shape",
                "member of another shape  | {" + GAINS
                        + ",\"verify\":{\"disturbances\":[{\"shape\":\"step\",\"amplitude\":1,\"frequency\":3}]}} | 400 | /verify/disturbances/0/frequency",
                "pulse without duration   | {" + GAINS
                        + ",\"verify\":{\"disturbances\":[{\"shape\":\"pulse\",\"amplitude\":1}]}} | 400 | /verify/disturbances/0/duration",
                "unknown verify field     | {" + GAINS
                        + ",\"verify\":{\"horizonOverride\":3}}                     | 400 | /verify/horizonOverride",
                "gamma in spec            | {" + GAINS
                        + ",\"spec\":{\"gamma\":3}}                                 | 400 | /spec/gamma",
                "missing gain             | {\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}}                   | 400 | /gain",
                "sample period over cap   | {" + GAINS
                        + ",\"verify\":{\"sampling\":{\"samplePeriod\":1e-7}}}        | 422 | /verify/sampling/samplePeriod",
                "delay over cap           | {" + GAINS
                        + ",\"verify\":{\"inputDelay\":100}}                        | 422 | /verify/inputDelay",
                "late disturbance         | {" + GAINS
                        + ",\"verify\":{\"disturbances\":[{\"shape\":\"step\",\"amplitude\":1,\"start\":1000}]}} | 422 | /verify/disturbances/0",
                "unstable gains           | {\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"gain\":{\"k1\":-1,\"k2\":0.1,\"referenceGain\":1}} | 422 | /gain",
            })
    void capsAndBadOptionsAreProblems(String name, String body, int status, String pointer) {
        LiveServer.Reply reply = server.post("/v1/verifications", body);
        assertEquals(status, reply.status(), reply.text());
        assertEquals(pointer, reply.json().at("/errors/0/pointer").asText(), reply.text());
        if (status == 422 && !name.startsWith("unstable")) {
            assertEquals(
                    "tag:loopwright.dev,2026:problem/cap-exceeded",
                    reply.json().get("type").asText());
            assertTrue(reply.json().get("detail").asText().matches(".*\\d.*"), "the cap is stated");
        }
    }

    @Test
    void manyBadProfilesGiveAtMostTheDocumentedNumberOfFieldErrors() {
        String bad = "{\"shape\":\"pulse\",\"amplitude\":1e99,\"start\":-1,\"frequency\":1,\"holdTime\":1,\"seed\":2}";
        String body = "{" + GAINS + ",\"verify\":{\"disturbances\":["
                + String.join(",", java.util.Collections.nCopies(8, bad)) + "]}}";
        LiveServer.Reply reply = server.post("/v1/verifications", body);
        assertEquals(400, reply.status(), reply.text());
        assertEquals(32, reply.json().get("errors").size());
    }

    @Test
    void verifyOptionsOfADesignAreValidatedToo() {
        LiveServer.Reply reply =
                server.post("/v1/designs", "{" + AXIS + ",\"verify\":{\"uncertainty\":{\"monteCarloSamples\":5000}}}");
        assertEquals(400, reply.status());
        assertEquals(
                "/verify/uncertainty/monteCarloSamples",
                reply.json().at("/errors/0/pointer").asText());
    }
}
