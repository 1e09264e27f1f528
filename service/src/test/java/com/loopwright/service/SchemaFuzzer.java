package com.loopwright.service;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Random;

/**
 * Generates request bodies from the schemas in openapi.yaml and mutates them: wrong types, missing required
 * fields, huge and overflowing numbers, NaN/Infinity tokens and strings, deep nesting, huge arrays, unknown
 * and duplicate keys, truncation, invalid UTF-8 and random byte flips. Deterministic for a given Random.
 */
final class SchemaFuzzer {

    /** Caps of the generator itself. */
    static final int MAX_GENERATED_ITEMS = 3;

    static final int MAX_NESTING = 6000;
    static final int MAX_HUGE_ARRAY = 20_000;
    /** Longer than the default 1 MiB request cap. */
    static final int OVERSIZED_STRING = (1 << 20) + 4096;

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

    private final JsonNode document;

    SchemaFuzzer(JsonNode document) {
        this.document = document;
    }

    /** A value that conforms to the named component schema (ranges, required members, array caps). */
    JsonNode valid(String component, Random random) {
        return generate(document.at("/components/schemas/" + component), random, 0);
    }

    private JsonNode resolve(JsonNode schema) {
        JsonNode ref = schema.get("$ref");
        return ref == null ? schema : document.at(ref.asText().substring(1));
    }

    private JsonNode generate(JsonNode schema, Random random, int depth) {
        schema = resolve(schema);
        if (schema.has("enum")) {
            JsonNode values = schema.get("enum");
            return values.get(random.nextInt(values.size()));
        }
        String type = schema.path("type").asText("object");
        switch (type) {
            case "object" -> {
                ObjectNode object = NODES.objectNode();
                List<String> required = new ArrayList<>();
                schema.path("required").forEach(r -> required.add(r.asText()));
                for (Iterator<String> names = schema.path("properties").fieldNames(); names.hasNext(); ) {
                    String name = names.next();
                    if (required.contains(name) || random.nextInt(3) == 0) {
                        object.set(name, generate(schema.get("properties").get(name), random, depth + 1));
                    }
                }
                return object;
            }
            case "array" -> {
                ArrayNode array = NODES.arrayNode();
                int min = schema.path("minItems").asInt(0);
                int max = Math.min(schema.path("maxItems").asInt(MAX_GENERATED_ITEMS), MAX_GENERATED_ITEMS);
                int count = min + random.nextInt(Math.max(1, max - min + 1));
                for (int i = 0; i < count; i++) {
                    array.add(generate(schema.get("items"), random, depth + 1));
                }
                return array;
            }
            case "number", "integer" -> {
                double low = schema.has("minimum")
                        ? schema.get("minimum").asDouble()
                        : schema.has("exclusiveMinimum")
                                ? schema.get("exclusiveMinimum").asDouble()
                                : -1e3;
                double high = schema.has("maximum") ? schema.get("maximum").asDouble() : 1e3;
                double value;
                if (random.nextBoolean()) {
                    value = low + (high - low) * random.nextDouble();
                } else {
                    // Log-uniform magnitude inside the range: wide ranges are explored at every scale.
                    double magnitude = Math.pow(10, -4 + random.nextDouble() * (Math.log10(Math.max(high, 1)) + 4));
                    value = Math.max(low, Math.min(high, random.nextBoolean() || low >= 0 ? magnitude : -magnitude));
                }
                if (schema.has("exclusiveMinimum") && value <= low) {
                    value = low + Math.ulp(low) + 1e-9;
                }
                return type.equals("integer") ? NODES.numberNode(Math.round(value)) : NODES.numberNode(value);
            }
            case "boolean" -> {
                return NODES.booleanNode(random.nextBoolean());
            }
            default -> {
                return NODES.textNode("conveyor-" + random.nextInt(100));
            }
        }
    }

    /** One mutation of a valid value, as bytes on the wire. */
    byte[] mutate(JsonNode valid, Random random) {
        JsonNode tree = valid.deepCopy();
        int kind = random.nextInt(16);
        switch (kind) {
            case 0 -> {
                return bytes(tree);
            }
            case 1 -> replaceRandomLeaf(tree, random, wrongType(random));
            case 2 -> removeRandomMember(tree, random);
            case 3 -> replaceRandomLeaf(tree, random, NODES.numberNode(random.nextBoolean() ? 1e308 : -1e308));
            case 4 -> {
                return splice(
                        tree,
                        random,
                        random.nextBoolean()
                                ? "1e400"
                                : "123456789012345678901234567890"
                                        + "12345678901234567890123456789012345678901234567890123456789012345678901234567890");
            }
            case 5 -> {
                return splice(
                        tree,
                        random,
                        new String[] {"NaN", "Infinity", "-Infinity", "\"NaN\"", "\"Infinity\""}[random.nextInt(5)]);
            }
            case 6 -> {
                int depth = 17 + random.nextInt(MAX_NESTING);
                return splice(tree, random, "[".repeat(depth) + "]".repeat(depth));
            }
            case 7 -> {
                ArrayNode huge = NODES.arrayNode();
                int size = 1001 + random.nextInt(MAX_HUGE_ARRAY);
                for (int i = 0; i < size; i++) {
                    huge.add(random.nextInt(10));
                }
                replaceRandomLeaf(tree, random, huge);
            }
            case 8 -> {
                byte[] body = bytes(tree);
                int at = random.nextInt(body.length);
                byte[] bad = {(byte) 0xC3, (byte) 0x28, (byte) 0xFF, (byte) 0xFE, (byte) 0xED, (byte) 0xA0, (byte) 0x80
                };
                byte[] out = new byte[body.length + bad.length];
                System.arraycopy(body, 0, out, 0, at);
                System.arraycopy(bad, 0, out, at, bad.length);
                System.arraycopy(body, at, out, at + bad.length, body.length - at);
                return out;
            }
            case 9 -> addUnknownMember(tree, random);
            case 10 -> {
                String text = new String(bytes(tree), StandardCharsets.UTF_8);
                int brace = text.indexOf('{', 1);
                return (brace < 0
                                ? text
                                : text.substring(0, brace + 1) + "\"a0\":1,\"a0\":2," + text.substring(brace + 1))
                        .getBytes(StandardCharsets.UTF_8);
            }
            case 11 -> {
                byte[] body = bytes(tree);
                return java.util.Arrays.copyOf(body, random.nextInt(body.length));
            }
            case 12 -> {
                byte[] body = bytes(tree);
                for (int flips = 1 + random.nextInt(4); flips > 0; flips--) {
                    body[random.nextInt(body.length)] = (byte) random.nextInt(256);
                }
                return body;
            }
            case 13 -> {
                return (new String(bytes(tree), StandardCharsets.UTF_8) + (random.nextBoolean() ? " {}" : " x"))
                        .getBytes(StandardCharsets.UTF_8);
            }
            case 14 ->
                replaceRandomLeaf(
                        tree,
                        random,
                        NODES.textNode("x".repeat(random.nextInt(8) == 0 ? OVERSIZED_STRING : random.nextInt(20_000))));
            default -> replaceRandomLeaf(tree, random, NODES.numberNode(random.nextBoolean() ? 0.0 : -0.0));
        }
        return bytes(tree);
    }

    private static JsonNode wrongType(Random random) {
        return switch (random.nextInt(6)) {
            case 0 -> NODES.textNode("400");
            case 1 -> NODES.booleanNode(true);
            case 2 -> NODES.nullNode();
            case 3 -> NODES.arrayNode().add(1);
            case 4 -> NODES.objectNode();
            default -> NODES.numberNode(7);
        };
    }

    /** Replaces a random value (a leaf or a whole subtree) with the given one. */
    private static void replaceRandomLeaf(JsonNode tree, Random random, JsonNode replacement) {
        List<JsonNode> containers = new ArrayList<>();
        collectContainers(tree, containers);
        JsonNode container = containers.get(random.nextInt(containers.size()));
        if (container instanceof ObjectNode object && object.size() > 0) {
            List<String> names = new ArrayList<>();
            object.fieldNames().forEachRemaining(names::add);
            object.set(names.get(random.nextInt(names.size())), replacement);
        } else if (container instanceof ArrayNode array && array.size() > 0) {
            array.set(random.nextInt(array.size()), replacement);
        } else if (container instanceof ObjectNode object) {
            object.set("extra", replacement);
        }
    }

    private static void removeRandomMember(JsonNode tree, Random random) {
        List<JsonNode> containers = new ArrayList<>();
        collectContainers(tree, containers);
        JsonNode container = containers.get(random.nextInt(containers.size()));
        if (container instanceof ObjectNode object && object.size() > 0) {
            List<String> names = new ArrayList<>();
            object.fieldNames().forEachRemaining(names::add);
            object.remove(names.get(random.nextInt(names.size())));
        } else if (container instanceof ArrayNode array && array.size() > 0) {
            array.remove(random.nextInt(array.size()));
        }
    }

    private static void addUnknownMember(JsonNode tree, Random random) {
        List<JsonNode> containers = new ArrayList<>();
        collectContainers(tree, containers);
        for (JsonNode container : containers) {
            if (container instanceof ObjectNode object && random.nextBoolean()) {
                object.put("mass" + random.nextInt(10), 1.5);
                return;
            }
        }
        if (tree instanceof ObjectNode object) {
            object.put("inertia", 2);
        }
    }

    private static void collectContainers(JsonNode node, List<JsonNode> out) {
        if (node.isContainerNode()) {
            out.add(node);
            node.elements().forEachRemaining(child -> collectContainers(child, out));
        }
    }

    /** Replaces a random number token in the serialized text with raw (possibly non-JSON) text. */
    private static byte[] splice(JsonNode tree, Random random, String raw) {
        String text = new String(bytes(tree), StandardCharsets.UTF_8);
        List<int[]> numbers = new ArrayList<>();
        java.util.regex.Matcher matcher =
                java.util.regex.Pattern.compile("-?[0-9][0-9.eE+-]*").matcher(text);
        while (matcher.find()) {
            numbers.add(new int[] {matcher.start(), matcher.end()});
        }
        if (numbers.isEmpty()) {
            return (raw + text).getBytes(StandardCharsets.UTF_8);
        }
        int[] at = numbers.get(random.nextInt(numbers.size()));
        return (text.substring(0, at[0]) + raw + text.substring(at[1])).getBytes(StandardCharsets.UTF_8);
    }

    static byte[] bytes(JsonNode tree) {
        try {
            return JSON.writeValueAsBytes(tree);
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new AssertionError(e);
        }
    }
}
