package com.loopwright.api.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.DecodeFailures;
import com.loopwright.api.json.StrictJson;
import java.lang.reflect.RecordComponent;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Differential test: the sealed plant model decodes every plant object exactly as the former flat record did.
 * Both are decoded from the same body, from bytes and from a tree (the batch route decodes items from trees);
 * a failure must give the same problem (status, detail, pointer), a success the same fields, now in the record of
 * the chosen form, or the same unknown form or fields of other forms. Source of truth: the former record,
 * kept verbatim as {@link FormerFlatPlantInput}; the recorded golden answers were made with it.
 */
class PlantDecodingEquivalenceTest {

    /** Bounded so the test stays a few seconds: generated bodies per run. */
    private static final int GENERATED_BODIES = 3000;

    private static final int MAX_FIELDS_PER_OBJECT = 7;
    private static final long SEED = 20261203L;

    private static final ObjectMapper STRICT = StrictJson.newMapper();

    record Former(FormerFlatPlantInput plant, Double after) {}

    record Current(PlantInput plant, Double after) {}

    private static final List<String> NAMES = names();
    private static final String[] UNKNOWN_NAMES = {"foo", "length", "Form", "a2", ""};
    private static final String[] VALUES = {
        "1",
        "0",
        "-2.5",
        "1e3",
        "1e999",
        "-0.0",
        "12345678901234567890",
        "1" + "0".repeat(150),
        "\"x\"",
        "\"1.5\"",
        "\"\"",
        "null",
        "true",
        "false",
        "NaN",
        "-Infinity",
        "[]",
        "[1]",
        "[1,2]",
        "[1,2,3]",
        "[0,0,4]",
        "[[1,2],[3,4]]",
        "[[1,\"x\"],[3,4]]",
        "[null]",
        "[1,[2]]",
        "[{}]",
        "{}",
        "{\"a\":1}",
        "[".repeat(20) + "1" + "]".repeat(20),
        "[1,NaN]",
        "[[1,2],null]"
    };
    private static final String[] FORMS = {
        "\"canonical\"",
        "\"rotaryAxis\"",
        "\"massSpringDamper\"",
        "\"secondOrderTransferFunction\"",
        "\"stateSpace\"",
        "\"bogus\"",
        "\"\"",
        "3",
        "null",
        "true",
        "{}",
        "[\"rotaryAxis\"]"
    };
    private static final String[] NOT_OBJECTS = {"\"x\"", "\"\"", "3", "1.5", "[]", "[{}]", "true", "null"};

    @Test
    void everyGeneratedPlantDecodesAsTheFormerRecordDid() {
        Random random = new Random(SEED);
        int failures = 0;
        int successes = 0;
        for (int i = 0; i < GENERATED_BODIES; i++) {
            String plant = switch (i % 10) {
                case 0 -> NOT_OBJECTS[random.nextInt(NOT_OBJECTS.length)];
                case 1 -> everyField(random);
                default -> object(random);
            };
            String after = random.nextInt(4) == 0 ? "\"late\"" : "2";
            String body = random.nextBoolean()
                    ? "{\"plant\":" + plant + ",\"after\":" + after + "}"
                    : "{\"after\":" + after + ",\"plant\":" + plant + "}";
            String outcome = assertSameDecoding(body);
            if (outcome.equals("ok")) {
                successes++;
            } else {
                failures++;
            }
        }
        // the generator reaches both sides: bodies that decode and bodies that fail
        assertTrue(successes > GENERATED_BODIES / 10, "decoded " + successes);
        assertTrue(failures > GENERATED_BODIES / 10, "failed " + failures);
    }

    /** Every field of every form, well typed: once all are read, the former record refused an unknown at once. */
    private static final String EVERY_FIELD = "\"form\":\"stateSpace\",\"a0\":1,\"a1\":1,\"b\":1,\"d\":1,"
            + "\"inertia\":1,\"viscousFriction\":1,\"torqueConstant\":1,\"gearRatio\":1,\"mass\":1,\"damping\":1,"
            + "\"stiffness\":1,\"gain\":1,\"naturalFrequency\":1,\"dampingRatio\":1,\"numerator\":[1],"
            + "\"denominator\":[1,2,3],\"disturbanceNumerator\":1,\"a\":[[1,2],[3,4]],\"b2\":[1,2],\"b1\":[1,2]";

    @Test
    void handPickedEdgesDecodeAsTheFormerRecordDid() {
        String[] plants = {
            "{}",
            "{\"form\":null}",
            "{\"form\":\"canonical\",\"a0\":1,\"a1\":2,\"b\":3,\"d\":4}",
            "{\"form\":\"rotaryAxis\",\"mass\":1,\"a0\":null}",
            "{\"mass\":1,\"inertia\":2}",
            "{\"foo\":1,\"a0\":\"x\"}",
            "{\"foo\":[[[[[[[[[[[[[[[[[[[[1]]]]]]]]]]]]]]]]]]]]}",
            "{\"a0\":[[[[[[[[[[[[[[[[[[[[1]]]]]]]]]]]]]]]]]]]]}",
            "{\"foo\":1,\"a0\":NaN}",
            "{\"a0\":0,\"a0\":1}",
            "{\"form\":3}",
            "{\"form\":{}}",
            "{\"numerator\":3}",
            "{\"a\":[[1,\"x\"]]}",
            "{\"a\":[1]}",
            "{\"form\":\"stateSpace\",\"a\":[[0,1],[0,-2]],\"b2\":[0,150],\"b1\":[0,60]}",
            "{\"form\":\"bogus\",\"mass\":1}",
            "{\"gearRatio\":1.0e400}",
            "{" + EVERY_FIELD + "}",
            "{\"foo\":1," + EVERY_FIELD + ",\"bar\":NaN}",
            "{" + EVERY_FIELD + ",\"bar\":1,\"baz\":NaN}",
            "{" + EVERY_FIELD + ",\"bar\":1,\"a0\":\"x\"}",
            "{\"foo\":1," + EVERY_FIELD + ",\"bar\":\"x\"}"
        };
        for (String plant : plants) {
            assertSameDecoding("{\"plant\":" + plant + ",\"after\":2}");
        }
    }

    /** Decodes with both models from bytes and from a tree; returns "ok" or the problem. */
    private static String assertSameDecoding(String body) {
        byte[] bytes = body.getBytes(StandardCharsets.UTF_8);
        String former = decode(() -> STRICT.readValue(bytes, Former.class));
        String current = decode(() -> STRICT.readValue(bytes, Current.class));
        assertEquals(former, current, body);
        assertTrue(!former.startsWith("unexpected"), former);
        JsonNode tree;
        try {
            tree = STRICT.readTree(bytes);
        } catch (Exception e) {
            return former.startsWith("ok") ? "ok" : "failed"; // not a tree: only the byte route applies
        }
        String formerTree = decode(() -> STRICT.treeToValue(tree, Former.class));
        String currentTree = decode(() -> STRICT.treeToValue(tree, Current.class));
        assertEquals(formerTree, currentTree, "tree of " + body);
        return former.startsWith("ok") ? "ok" : "failed";
    }

    interface Decoding {
        Object run() throws Exception;
    }

    /** "ok" plus the fields as the sealed model should hold them, or the problem the failure becomes. */
    private static String decode(Decoding decoding) {
        Object decoded;
        try {
            decoded = decoding.run();
        } catch (JsonProcessingException e) {
            return DecodeFailures.toProblem(e).toString();
        } catch (Exception e) {
            return "unexpected " + e;
        }
        if (decoded instanceof Former former) {
            return "ok " + expected(former.plant()) + " after=" + former.after();
        }
        Current current = (Current) decoded;
        return "ok " + current.plant() + " after=" + current.after();
    }

    /**
     * What the sealed model must hold for a flat record: the former validator's reading of it (an unknown form;
     * present fields the chosen form does not take, in the flat record's order; or the chosen form's fields),
     * except that an absent form no longer means canonical: since v1 (issue 15) it makes no form at all.
     */
    private static String expected(FormerFlatPlantInput flat) {
        if (flat == null) {
            return "null";
        }
        var form =
                flat.form() == null ? java.util.Optional.<PlantFormName>empty() : PlantFormName.ofWireName(flat.form());
        if (form.isEmpty()) {
            return new UnmatchedPlant(flat.form(), List.of()).toString();
        }
        List<String> foreign = new ArrayList<>();
        java.util.Map<String, Object> values = new java.util.HashMap<>();
        for (RecordComponent component : FormerFlatPlantInput.class.getRecordComponents()) {
            Object value = value(component, flat);
            values.put(component.getName(), value);
            if (!component.getName().equals("form")
                    && value != null
                    && !form.get().fields().contains(component.getName())) {
                foreign.add(component.getName());
            }
        }
        if (!foreign.isEmpty()) {
            return new UnmatchedPlant(flat.form(), foreign).toString();
        }
        return form.get().instantiate(values).toString();
    }

    private static Object value(RecordComponent component, Object record) {
        try {
            return component.getAccessor().invoke(record);
        } catch (ReflectiveOperationException e) {
            throw new AssertionError(e);
        }
    }

    private static String object(Random random) {
        int count = random.nextInt(MAX_FIELDS_PER_OBJECT + 1);
        List<String> fields = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            int pick = random.nextInt(10);
            String name = pick == 0
                    ? UNKNOWN_NAMES[random.nextInt(UNKNOWN_NAMES.length)]
                    : NAMES.get(random.nextInt(NAMES.size()));
            String value = name.equals("form") ? FORMS[random.nextInt(FORMS.length)] : value(random, name);
            fields.add("\"" + name + "\":" + value);
        }
        return "{" + String.join(",", fields) + "}";
    }

    /** Mostly a value of the field's own type, sometimes any value. */
    private static String value(Random random, String name) {
        if (random.nextInt(3) > 0) {
            return switch (name) {
                case "numerator", "denominator", "b2", "b1" -> "[1,2,3]";
                case "a" -> "[[1,2],[3,4]]";
                default -> String.valueOf(random.nextInt(5) - 1);
            };
        }
        return VALUES[random.nextInt(VALUES.length)];
    }

    /** All 21 fields of the flat record, well typed, plus unknown or wrongly typed fields at random places. */
    private static String everyField(Random random) {
        List<String> fields = new ArrayList<>();
        for (String name : NAMES) {
            fields.add("\"" + name + "\":" + (name.equals("form") ? FORMS[random.nextInt(5)] : value(random, name)));
        }
        java.util.Collections.shuffle(fields, random);
        int extras = 1 + random.nextInt(2);
        for (int i = 0; i < extras; i++) {
            String name = random.nextBoolean()
                    ? UNKNOWN_NAMES[random.nextInt(UNKNOWN_NAMES.length)]
                    : NAMES.get(random.nextInt(NAMES.size()));
            String extra = "\"" + name + "\":" + VALUES[random.nextInt(VALUES.length)];
            fields.add(random.nextInt(fields.size() + 1), extra);
        }
        return "{" + String.join(",", fields) + "}";
    }

    private static List<String> names() {
        List<String> names = new ArrayList<>();
        for (RecordComponent component : FormerFlatPlantInput.class.getRecordComponents()) {
            names.add(component.getName());
        }
        return List.copyOf(names);
    }
}
