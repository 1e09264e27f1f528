package com.loopwright.api.json;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.design.DesignEndpoint;
import com.loopwright.api.design.DesignRequest;
import com.loopwright.api.endpoint.EndpointRunner;
import com.loopwright.api.endpoint.Reply;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The serializer-side never-NaN guard: it refuses exactly what the tree walk {@link FiniteNumbers} finds, at the
 * same JSON pointer (the independent route), writes finite values unchanged, and the fast double writer and
 * parser round-trip every double bit for bit.
 */
class FiniteNumbersModuleTest {

    record Leaf(double value, Double boxed, float single) {}

    record Shape(String name, Leaf leaf, List<Double> list, double[] samples, double[][] rows, List<Leaf> leaves) {}

    private static final ObjectMapper PLAIN = StrictJson.newMapper();
    private static final ObjectMapper GUARDED = FiniteNumbersModule.newResponseWriter();

    private static Shape finite() {
        return new Shape(
                "conveyor",
                new Leaf(1.5, -2.25, 0.5f),
                List.of(0.1, 0.2, 0.3),
                new double[] {1, 2, 3},
                new double[][] {{1, 2}, {3, 4}},
                List.of(new Leaf(0, 1.0, 2f), new Leaf(3, 4.0, 5f)));
    }

    /** Every position a double can sit in a response record, each with NaN, +Infinity and -Infinity. */
    private static List<Shape> poisoned(double bad) {
        Shape f = finite();
        return List.of(
                new Shape(f.name(), new Leaf(bad, 1.0, 1f), f.list(), f.samples(), f.rows(), f.leaves()),
                new Shape(f.name(), new Leaf(1, bad, 1f), f.list(), f.samples(), f.rows(), f.leaves()),
                new Shape(f.name(), new Leaf(1, 1.0, (float) bad), f.list(), f.samples(), f.rows(), f.leaves()),
                new Shape(f.name(), f.leaf(), List.of(0.1, bad, 0.3), f.samples(), f.rows(), f.leaves()),
                new Shape(f.name(), f.leaf(), List.of(bad), f.samples(), f.rows(), f.leaves()),
                new Shape(f.name(), f.leaf(), f.list(), new double[] {1, 2, bad}, f.rows(), f.leaves()),
                new Shape(f.name(), f.leaf(), f.list(), new double[] {bad}, f.rows(), f.leaves()),
                new Shape(f.name(), f.leaf(), f.list(), f.samples(), new double[][] {{1, 2}, {3, bad}}, f.leaves()),
                new Shape(
                        f.name(),
                        f.leaf(),
                        f.list(),
                        f.samples(),
                        f.rows(),
                        List.of(new Leaf(0, 1.0, 2f), new Leaf(3, bad, 5f))));
    }

    @Test
    void refusesEveryNonFiniteValueAtThePointerTheTreeWalkFinds() throws Exception {
        for (double bad : new double[] {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}) {
            for (Shape shape : poisoned(bad)) {
                // Independent route: the plain mapper keeps NaN as a number node; FiniteNumbers walks the tree.
                String expected = FiniteNumbers.firstNonFinite(PLAIN.valueToTree(shape));
                assertTrue(expected != null && !expected.isEmpty(), "the tree walk finds it");
                NonFiniteNumberException bytes =
                        assertThrows(NonFiniteNumberException.class, () -> GUARDED.writeValueAsBytes(shape));
                assertEquals(expected, bytes.pointer(), "writing bytes: " + shape);
                IllegalArgumentException tree =
                        assertThrows(IllegalArgumentException.class, () -> GUARDED.valueToTree(shape));
                assertEquals(expected, NonFiniteNumberException.in(tree).pointer(), "building a tree");
            }
        }
    }

    @Test
    void writesFiniteValuesAsThePlainMapperDoes() throws Exception {
        Shape shape = finite();
        // Through bytes on both sides (a tree keeps a float as a float node, text read back is a double node).
        assertEquals(PLAIN.readTree(PLAIN.writeValueAsBytes(shape)), PLAIN.readTree(GUARDED.writeValueAsBytes(shape)));
        assertEquals(PLAIN.valueToTree(shape), GUARDED.valueToTree(shape));
    }

    @Test
    void theFastWriterAndParserRoundTripEveryDoubleBitForBit() throws Exception {
        // Edge cases from memory (IEEE 754 binary64: subnormals, extremes, a value whose shortest form is long),
        // then random bit patterns over the whole finite range.
        double[] edges = {
            0.0,
            -0.0,
            Double.MIN_VALUE,
            -Double.MIN_VALUE,
            Double.MIN_NORMAL,
            Math.nextDown(Double.MIN_NORMAL),
            Double.MAX_VALUE,
            -Double.MAX_VALUE,
            0.1,
            0.2,
            0.3,
            1.0 / 3,
            2.0E-3,
            1.0E7,
            9.999999999999999E22,
            1.0E23,
            5.0E-324,
            4.9E-324,
            2.2250738585072014E-308,
            1.7976931348623157E308,
            0.48,
            400,
            23.921561032485474,
            2.5914335609051888E-5,
            5.611801696108024E-17
        };
        SplittableRandom random = new SplittableRandom(20261202);
        double[] values = new double[20_000 + edges.length];
        System.arraycopy(edges, 0, values, 0, edges.length);
        for (int i = edges.length; i < values.length; i++) {
            double v;
            do {
                v = Double.longBitsToDouble(random.nextLong());
            } while (!Double.isFinite(v));
            values[i] = v;
        }
        byte[] json = GUARDED.writeValueAsBytes(values);
        double[] fast = GUARDED.readValue(json, double[].class);
        assertEquals(values.length, fast.length);
        String[] tokens = new String(json, StandardCharsets.US_ASCII)
                .replace("[", "")
                .replace("]", "")
                .split(",");
        for (int i = 0; i < values.length; i++) {
            long bits = Double.doubleToRawLongBits(values[i]);
            assertEquals(bits, Double.doubleToRawLongBits(fast[i]), "fast writer -> fast parser: " + values[i]);
            // Independent parser: the JDK's correctly rounded Double.parseDouble of the written text.
            assertEquals(bits, Double.doubleToRawLongBits(Double.parseDouble(tokens[i])), tokens[i]);
        }
        // And the JDK's own text read by the fast parser.
        String jdkText = Arrays.stream(values)
                .mapToObj(Double::toString)
                .reduce((a, b) -> a + "," + b)
                .orElseThrow();
        double[] fromJdk = PLAIN.readValue("[" + jdkText + "]", double[].class);
        for (int i = 0; i < values.length; i++) {
            assertEquals(Double.doubleToRawLongBits(values[i]), Double.doubleToRawLongBits(fromJdk[i]));
        }
    }

    @Test
    void aDesignWrittenAsBytesIsTheDesignTreeNumberForNumber() throws Exception {
        EndpointRunner runner = new EndpointRunner(StrictJson.newMapper());
        DesignEndpoint endpoint = new DesignEndpoint();
        byte[] request = ("{\"plant\":{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400},"
                        + "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}}")
                .getBytes(StandardCharsets.UTF_8);
        Reply bytes = runner.run(endpoint, request);
        assertEquals(200, bytes.status());
        // Independent route: the same steps by hand, the response record turned into a tree by the plain mapper.
        DesignEndpoint.Validated validated = endpoint.validate(PLAIN.readValue(request, DesignRequest.class));
        JsonNode tree = PLAIN.valueToTree(endpoint.respond(validated, endpoint.compute(validated)));
        assertNull(FiniteNumbers.firstNonFinite(tree));
        // JsonNode equality compares doubles exactly (DoubleNode.equals on the double values' bits).
        // The runner adds the trace member last (which build answered which request): the rest is the record.
        JsonNode written = PLAIN.readTree(bytes.body());
        assertEquals(bytes.requestDigest(), written.at("/trace/requestDigest").asText());
        ((com.fasterxml.jackson.databind.node.ObjectNode) written).remove("trace");
        assertEquals(tree, written);
        assertTrue(tree.at("/verification/certified").asBoolean());
        // A bad request is the same problem from a body and from a parsed item.
        Reply bad = runner.run(endpoint, "{\"plant\":{}}".getBytes(StandardCharsets.UTF_8));
        assertEquals(runner.run(endpoint, PLAIN.readTree("{\"plant\":{}}")).problem(), bad.problem());
        assertEquals(400, bad.status());
        assertArrayEquals(bytes.body(), runner.run(endpoint, request).body(), "deterministic");
    }
}
