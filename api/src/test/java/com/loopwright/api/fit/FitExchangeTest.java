package com.loopwright.api.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.loopwright.api.endpoint.Answer;
import com.loopwright.api.json.FiniteNumbers;
import com.loopwright.api.json.StrictJson;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** POST /v1/models/fit without HTTP: the README example as documented, and the wire form of the intervals. */
class FitExchangeTest {

    private final ObjectMapper mapper = StrictJson.newMapper();

    private static JsonNode parameter(JsonNode fit, String name) {
        for (JsonNode p : fit.get("parameters")) {
            if (p.get("name").asText().equals(name)) {
                return p;
            }
        }
        throw new AssertionError("no parameter " + name + " in " + fit);
    }

    /** The overdamped textbook step 1 + (s1 e^{-s2 t} - s2 e^{-s1 t})/(s2 - s1) (Ogata, sec. 5-3). */
    private static double overdampedStep(double t, double wn, double zeta) {
        if (t <= 0) {
            return 0;
        }
        double root = Math.sqrt(zeta * zeta - 1);
        double s1 = wn * (zeta - root);
        double s2 = wn * (zeta + root);
        return 1 + (s1 * Math.exp(-s2 * t) - s2 * Math.exp(-s1 * t)) / (s2 - s1);
    }

    @Test
    void theReadmeExampleGivesTheDocumentedFit() throws IOException {
        String readme = Files.readString(Path.of("..", "README.md"));
        int start = readme.indexOf("/v1/models/fit <<'JSON'\n");
        String body = readme.substring(start + "/v1/models/fit <<'JSON'\n".length(), readme.indexOf("\nJSON\n", start));
        Answer outcome = Answer.fit(body.getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        JsonNode fit = outcome.body();
        // The numbers printed in the README under the example.
        assertEquals(1.60010, fit.at("/plant/gain").asDouble(), 5e-6);
        assertEquals(4.00000, fit.at("/plant/naturalFrequency").asDouble(), 5e-6);
        assertEquals(0.450091, fit.at("/plant/dampingRatio").asDouble(), 5e-7);
        assertEquals(1.59990, parameter(fit, "gain").get("lower95").asDouble(), 5e-6);
        assertEquals(1.60031, parameter(fit, "gain").get("upper95").asDouble(), 5e-6);
        assertEquals(0.099857, parameter(fit, "deadTime").get("lower95").asDouble(), 5e-7);
        assertEquals(0.100092, parameter(fit, "deadTime").get("upper95").asDouble(), 5e-7);
        assertEquals(0.000271, fit.at("/quality/rmsError").asDouble(), 5e-7);
        assertEquals(56, fit.at("/quality/degreesOfFreedom").asInt());
        assertEquals(5, fit.at("/quality/iterations").asInt());
        assertEquals(1, fit.get("warnings").size(), fit.get("warnings").toString());
        assertEquals("deadTimeNotInDesign", fit.at("/warnings/0/code").asText());
    }

    // Issue 12 item 12 on the wire: synthetic record (overdamped textbook step, wn 33.9, zeta 9.46, dead time
    // 0.1 s, offset 0.5, seeded Gaussian noise of 0.01, 41 samples 0.1 s apart). Its fast pole decays within a
    // sample, so J'J is singular at the optimum: the undetermined parameters carry no standard error and no
    // interval (absent, never 0, NaN or Infinity) and a poorlyDetermined warning.
    @Test
    void anUndeterminedParameterHasNoIntervalOnTheWire() {
        Random random = new Random(5);
        ObjectNode body = mapper.createObjectNode();
        ObjectNode samples = body.putObject("samples");
        ArrayNode time = samples.putArray("time");
        ArrayNode output = samples.putArray("output");
        for (int i = 0; i < 41; i++) {
            double t = 0.1 * i;
            time.add(t);
            output.add(0.5 + overdampedStep(t - 0.5 - 0.1, 33.9, 9.46) + 0.01 * random.nextGaussian());
        }
        body.put("stepTime", 0.5);
        body.put("estimateDeadTime", true);
        Answer outcome = Answer.fit(body.toString().getBytes(StandardCharsets.UTF_8));
        assertEquals(200, outcome.status(), () -> outcome.body().toString());
        JsonNode fit = outcome.body();
        assertNull(FiniteNumbers.firstNonFinite(fit));
        int undetermined = 0;
        for (JsonNode p : fit.get("parameters")) {
            if (p.has("standardError")) {
                assertTrue(p.get("standardError").asDouble() > 0, p.toString());
                assertTrue(p.get("lower95").asDouble() < p.get("upper95").asDouble(), p.toString());
            } else {
                undetermined++;
                assertFalse(p.has("lower95") || p.has("upper95"), p.toString());
            }
        }
        assertTrue(undetermined >= 2, fit.toString());
        boolean warned = false;
        for (JsonNode w : fit.get("warnings")) {
            warned |= w.get("code").asText().equals("poorlyDetermined");
        }
        assertTrue(warned, fit.get("warnings").toString());
    }
}
