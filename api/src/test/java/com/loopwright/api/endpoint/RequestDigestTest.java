package com.loopwright.api.endpoint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.StrictJson;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;

class RequestDigestTest {

    private static final ObjectMapper MAPPER = StrictJson.newMapper();
    private static final RequestDigest DIGESTS = new RequestDigest(MAPPER);
    private static final String DESIGN =
            "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}";
    private static final String DESIGN_REORDERED = "{ \"spec\" : {\"overshootPercent\": 1.5 ,\n \"settlingTime\":0.15},"
            + "\n\t\"plant\": {\"form\": \"canonical\", \"d\":400.0, \"b\":4e2, \"a1\":0.48, \"a0\":0} }";

    private static String digestOfTree(String json) throws Exception {
        return DIGESTS.of(MAPPER.readTree(json));
    }

    @Test
    void keyOrderWhitespaceAndNumberSpellingDoNotChangeTheDigest() throws Exception {
        assertEquals(digestOfTree(DESIGN), digestOfTree(DESIGN_REORDERED));
    }

    @Test
    void theDecodedDesignRequestDigestIsTheSameForBothSpellings() {
        Reply plain = new EndpointRunner(MAPPER).run(new com.loopwright.api.design.DesignEndpoint(), bytes(DESIGN));
        Reply reordered =
                new EndpointRunner(MAPPER).run(new com.loopwright.api.design.DesignEndpoint(), bytes(DESIGN_REORDERED));
        assertEquals(200, plain.status());
        assertTrue(plain.requestDigest().matches("sha256:[0-9a-f]{64}"), plain.requestDigest());
        assertEquals(plain.requestDigest(), reordered.requestDigest());
        assertTrue(plain.text().contains("\"requestDigest\":\"" + plain.requestDigest() + "\""), plain.text());
    }

    @Test
    void aChangedValueChangesTheDigest() throws Exception {
        assertNotEquals(digestOfTree(DESIGN), digestOfTree(DESIGN.replace("1.5}", "1.6}")));
        assertNotEquals(digestOfTree("{\"a\":[1,2]}"), digestOfTree("{\"a\":[2,1]}"));
    }

    @Test
    void aNullMemberIsTheSameAsAnAbsentOne() throws Exception {
        assertEquals(digestOfTree("{\"a\":1}"), digestOfTree("{\"b\":null,\"a\":1}"));
    }

    /**
     * Known vector. Canonical bytes of {"b": [1, 2.5], "a": "x"}: {"a":"x","b":[1.0,2.5]} (members sorted, numbers
     * as Jackson writes doubles, no whitespace). The hex was computed once with coreutils:
     * printf '{"a":"x","b":[1.0,2.5]}' | sha256sum
     */
    @Test
    void knownVectorMatchesMessageDigestAndSha256sum() throws Exception {
        JsonNode tree = MAPPER.readTree("{\"b\": [1, 2.5], \"a\": \"x\"}");
        String canonical = "{\"a\":\"x\",\"b\":[1.0,2.5]}";
        assertEquals(canonical, new String(DIGESTS.canonicalBytes(tree), StandardCharsets.UTF_8));
        String direct = HexFormat.of()
                .formatHex(MessageDigest.getInstance("SHA-256").digest(canonical.getBytes(StandardCharsets.UTF_8)));
        assertEquals("sha256:" + direct, DIGESTS.of(tree));
        assertEquals("sha256:2dca0a6571a2c69e34ffb05346181c7abe422b19c81a2515ac525d2aba7f25d1", DIGESTS.of(tree));
    }

    @Test
    void theEnvelopeDigestIsTheDigestOfTheItemsObject() throws Exception {
        List<JsonNode> items = List.of(MAPPER.readTree(DESIGN), MAPPER.readTree("{\"x\":2}"));
        String whole = digestOfTree("{\"items\":[" + DESIGN_REORDERED + ",{\"x\":2.0}]}");
        assertEquals(whole, DIGESTS.ofItems(items.size(), items::get));
    }

    @Test
    void theVersionComesFromTheBuild() {
        String version = ServiceVersion.fromBuild();
        assertTrue(version.matches("\\d+\\.\\d+\\.\\d+.*"), version);
        assertEquals(version, new EndpointRunner(MAPPER).serviceVersion());
    }

    private static byte[] bytes(String json) {
        return json.getBytes(StandardCharsets.UTF_8);
    }
}
