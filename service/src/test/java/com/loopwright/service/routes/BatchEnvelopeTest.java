package com.loopwright.service.routes;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.StrictJson;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/** The batch envelope is read as a stream: its memory does not grow with what an item holds. */
class BatchEnvelopeTest {

    private final ObjectMapper mapper = StrictJson.newMapper();

    /** Bytes allocated by this thread while {@code work} runs (HotSpot's per-thread allocation counter). */
    private static long allocatedBytes(Runnable work) {
        var threads = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long thread = Thread.currentThread().getId();
        long before = threads.getThreadAllocatedBytes(thread);
        work.run();
        return threads.getThreadAllocatedBytes(thread) - before;
    }

    @Test
    void aOneMegabyteItemOfNumbersIsNeverBuiltAsATree() throws Exception {
        // Issue 13: {"items":[[1.5, ... x 262,140]]} (1 MiB) was parsed into a tree of 262,140 nodes on an HTTP thread.
        StringBuilder text = new StringBuilder(1 << 20).append("{\"items\":[[");
        for (int i = 0; i < 262_140; i++) {
            text.append(i == 0 ? "1.5" : ",1.5");
        }
        byte[] body = text.append("]]}").toString().getBytes(StandardCharsets.US_ASCII);
        assertTrue(body.length < 1 << 20);
        BatchEnvelope.read(mapper, body, 1000); // warm up the parser's classes and buffers
        long streamed = allocatedBytes(() -> {
            try {
                BatchEnvelope envelope = BatchEnvelope.read(mapper, body, 1000);
                assertEquals(1, envelope.size());
                JsonNode item = envelope.item(0);
                assertTrue(item.isArray() && item.isEmpty(), "a non-object item is given empty: " + item);
            } catch (Exception e) {
                throw new AssertionError(e);
            }
        });
        long tree = allocatedBytes(() -> {
            try {
                mapper.readTree(body);
            } catch (Exception e) {
                throw new AssertionError(e);
            }
        });
        // A tree costs about ten bytes per body byte (one node object per number: 10.6 MB measured on this body),
        // the stream about one (1.05 MB measured, short-lived parser buffers), whatever an item holds.
        assertTrue(streamed < 3L * body.length / 2, "streamed envelope allocated " + streamed + " bytes");
        assertTrue(tree > 8L * body.length, "a tree of the body allocates " + tree + " bytes (the contrast)");
    }

    @Test
    void objectItemsAreReadBackExactlyAndTheCapIsCountedWhileStreaming() throws Exception {
        String one =
                "{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},\"spec\":{\"settlingTime\":0.15,"
                        + "\"overshootPercent\":1.5}}";
        byte[] body = ("{\"items\":[" + one + ", \"text\" ,[1,2], 7," + one + "]}").getBytes(StandardCharsets.UTF_8);
        BatchEnvelope envelope = BatchEnvelope.read(mapper, body, 5);
        assertEquals(5, envelope.size());
        assertEquals(mapper.readTree(one), envelope.item(0));
        assertEquals("text", envelope.item(1).asText());
        assertTrue(envelope.item(2).isArray());
        assertEquals(7, envelope.item(3).asInt());
        assertEquals(mapper.readTree(one), envelope.item(4));
        // Strings are decoded while skipped, so the parser's caps hold as in a full parse (not only when an item is
        // read again): one string of 12,000 characters in an item is a malformed body.
        byte[] longString =
                ("{\"items\":[{\"plant\":\"" + "x".repeat(12_000) + "\"}]}").getBytes(StandardCharsets.UTF_8);
        assertThrows(
                com.fasterxml.jackson.core.exc.StreamConstraintsException.class,
                () -> BatchEnvelope.read(mapper, longString, 5));
        BatchEnvelope.Invalid overCap =
                assertThrows(BatchEnvelope.Invalid.class, () -> BatchEnvelope.read(mapper, body, 4));
        assertEquals("/items", overCap.problem().errors().get(0).pointer());
        assertTrue(
                overCap.problem().detail().endsWith("not 5"), overCap.problem().detail());
    }
}
