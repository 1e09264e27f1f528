package com.loopwright.api.takeaway;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.endpoint.Answer;
import com.loopwright.api.json.StrictJson;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import org.junit.jupiter.api.Test;

/**
 * The exported controller quotes the sampled loop's own step metrics beside the continuous ones (issue 12,
 * item 10). The numbers are checked against the exact sampled double integrator in SampledStepMetricsTest
 * (solver); here they must equal the emulated metrics that POST /v1/designs reports with verify.sampling at the
 * same period (the same sampled-loop simulation, reached through the other endpoint).
 */
class ExportedStepMetricsTest {

    private static final String DESIGN = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}";
    /** wn T = 0.15 for this design (wn = 25.08 rad/s). */
    private static final double PERIOD = 0.006;

    private final ObjectMapper mapper = StrictJson.newMapper();

    private Answer export(String format) {
        String body = "{\"design\":" + DESIGN + "},\"samplePeriod\":" + PERIOD + ",\"actuatorLimit\":10}";
        return Answer.controller(format, body.getBytes(StandardCharsets.UTF_8));
    }

    @Test
    void parameterSetAndHeadersQuoteTheSampledLoop() throws Exception {
        Answer parameters = export("parameters");
        assertEquals(200, parameters.status(), () -> String.valueOf(parameters.problem()));
        JsonNode json = mapper.readTree(parameters.text());
        JsonNode continuous = json.get("continuousStep");
        JsonNode sampled = json.get("sampledStep");

        Answer verified = Answer.design((DESIGN + ",\"verify\":{\"sampling\":{\"samplePeriod\":" + PERIOD + "}}}")
                .getBytes(StandardCharsets.UTF_8));
        assertEquals(200, verified.status(), () -> verified.body().toString());
        JsonNode emulated = verified.body().at("/robustness/sampled/emulated");
        for (String field : new String[] {"overshootPercent", "riseTime", "settlingTime"}) {
            assertEquals(emulated.get(field).asDouble(), sampled.get(field).asDouble(), 0, field);
        }
        assertEquals(
                verified.body().at("/simulated/overshootPercent").asDouble(),
                continuous.get("overshootPercent").asDouble(),
                1e-12);
        assertTrue(
                Math.abs(sampled.get("overshootPercent").asDouble()
                                - continuous.get("overshootPercent").asDouble())
                        > 0.01,
                "the two differ at wn T = 0.15");

        String line = String.format(
                Locale.ROOT, "overshoot %.5g%%", sampled.get("overshootPercent").asDouble());
        for (String format : new String[] {"structured-text", "c-header", "c-source", "plcopen-xml"}) {
            String code = export(format).text();
            assertTrue(code.contains("Simulated (sampled at T = " + PERIOD + " s"), format);
            assertTrue(code.contains(line), format + " quotes " + line);
            assertTrue(code.contains("Simulated (continuous, unclamped)"), format);
        }
    }

    // A period so short against the loop's horizon (18 s at 1e-5 s: 1.8 million intervals, over the simulator's
    // cap) is not simulated: the parameter set leaves sampledStep out and the header says why.
    @Test
    void aPeriodTooShortToSimulateIsSaidSo() throws Exception {
        String slow = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                + "\"spec\":{\"settlingTime\":1.5,\"overshootPercent\":1.5}}";
        for (String format : new String[] {"parameters", "c-source"}) {
            Answer exported = Answer.controller(
                    format,
                    ("{\"design\":" + slow + ",\"samplePeriod\":1e-5,\"actuatorLimit\":10}")
                            .getBytes(StandardCharsets.UTF_8));
            assertEquals(200, exported.status(), () -> String.valueOf(exported.problem()));
            if (format.equals("parameters")) {
                JsonNode json = mapper.readTree(exported.text());
                assertTrue(json.has("continuousStep") && !json.has("sampledStep"), exported.text());
            } else {
                assertTrue(exported.text().contains("Simulated (sampled): not simulated"), exported.text());
            }
        }
    }
}
