package com.loopwright.service.golden;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.StrictJson;
import com.loopwright.service.compute.BatchItem;
import com.loopwright.service.compute.ExchangeDesigns;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/**
 * A batch item is designed from its bytes (no tree); the reply must be the one the tree route gives, byte for byte:
 * same status, problem (pointers and details included), body and digest. Checked on every single-design request of
 * the golden corpus that a batch envelope could hold (a JSON object with no duplicate key), the malformed and
 * invalid ones included, each placed inside a larger body as it is inside an envelope.
 */
class BatchItemDecodingTest {

    private final ObjectMapper mapper = StrictJson.newMapper();
    private final ExchangeDesigns designs = new ExchangeDesigns(mapper);

    @Test
    void everyDesignRequestOfTheCorpusDecodesFromItsBytesAsFromItsTree() {
        int compared = 0;
        int problems = 0;
        for (GoldenCase golden : GoldenCases.all()) {
            if (!golden.path().equals("/v1/designs") || golden.body() == null) {
                continue;
            }
            JsonNode tree;
            try {
                tree = mapper.readTree(golden.body());
            } catch (IOException notAnItem) {
                continue; // bad JSON: a batch envelope holding it is refused as a whole (400) before any design
            }
            if (tree == null || !tree.isObject()) {
                continue; // a non-object item is designed through its tree in both routes
            }
            byte[] item = golden.body().getBytes(StandardCharsets.UTF_8);
            byte[] envelope = ("{\"items\":[" + golden.body() + "]}").getBytes(StandardCharsets.UTF_8);
            int offset = "{\"items\":[".length();
            var fromTree = designs.design(tree);
            var fromBytes = designs.design(new BatchItem(mapper, envelope, offset, item.length));
            assertEquals(fromTree, fromBytes, golden.id());
            compared++;
            if (!fromTree.ok()) {
                problems++;
            }
        }
        // The corpus holds dozens of such requests, designed and refused (a check that compared nothing is void).
        assertTrue(compared > 50 && problems > 20, compared + " compared, " + problems + " problems");
    }
}
