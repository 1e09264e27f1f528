package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Integer fields take integer tokens only: a fraction is a 400 at the field, never truncated (monteCarloSamples
 * 2.9 used to become 2), on POST /v1/designs and on each line of POST /v1/designs/batch.
 */
class IntegerFieldsTest extends LiveServerTest {

    private static final String HEAD = "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
            + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5},\"verify\":";

    // The reproductions of the issue: monteCarloSamples 2.9, seed 7.9, timeSeriesPoints 10.7.
    @ParameterizedTest
    @CsvSource(
            delimiter = '|',
            value = {
                "{\"uncertainty\":{\"a1\":{\"spreadPercent\":10},\"monteCarloSamples\":2.9}} | /verify/uncertainty/monteCarloSamples",
                "{\"uncertainty\":{\"a1\":{\"spreadPercent\":10},\"monteCarloSamples\":3,\"seed\":7.9}} | /verify/uncertainty/seed",
                "{\"timeSeriesPoints\":10.7} | /verify/timeSeriesPoints",
            })
    void aFractionInAnIntegerFieldIsA400AtTheField(String verify, String pointer) {
        String request = HEAD + verify + "}";
        var single = server.post("/v1/designs", request);
        assertEquals(400, single.status(), single.text());
        assertEquals(pointer, single.json().at("/errors/0/pointer").asText(), single.text());
        assertTrue(single.json().at("/errors/0/detail").asText().contains("whole number"), single.text());

        var batch = server.post("/v1/designs/batch", "{\"items\":[" + request + "," + HEAD + "{}}]}");
        assertEquals(200, batch.status(), batch.text());
        JsonNode line = batch.lines().get(0);
        assertEquals(400, line.get("status").asInt(), batch.text());
        assertEquals(pointer, line.at("/problem/errors/0/pointer").asText(), batch.text());
        assertEquals(200, batch.lines().get(1).get("status").asInt(), "the other item is still designed");
    }
}
