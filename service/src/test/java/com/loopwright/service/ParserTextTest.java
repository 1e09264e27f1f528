package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Hostile bodies sent to every JSON endpoint: every answer is a problem worded by us (no parser text: source
 * excerpt, line and column, token dumps, class names), and a nested duplicate key, NaN or trailing comma is named at
 * its own pointer with its cause, as at top level. The instance names the occurrence by its request id.
 */
class ParserTextTest extends LiveServerTest {

    /** Texts of the parser that must never reach a client (Jackson's message parts, from its exception messages). */
    private static final List<String> PARSER_TEXT =
            List.of("Source:", "line:", "column:", "java.", "com.fasterxml", "Unrecognized");

    private static final String PLANT = "{\"form\":\"canonical\",\"a0\":0,\"a1\":0.48,\"b\":400,\"d\":400}";
    private static final String SPEC_REST = "\"overshootPercent\":1.5";

    /**
     * One JSON endpoint: {@code template} holds {@code @} where a nested object sits, at {@code pointer}; that object
     * is {"F": value, rest} with a known number field F.
     */
    private record Host(String path, String template, String pointer, String field, String value, String rest) {
        String body(String nested) {
            return template.replace("@", nested);
        }

        String object(String members) {
            return "{" + members + "}";
        }
    }

    private static final List<Host> HOSTS = List.of(
            new Host("/v1/designs", "{\"plant\":" + PLANT + ",\"spec\":@}", "/spec", "settlingTime", "0.15", SPEC_REST),
            new Host(
                    "/v1/designs/high-order",
                    "{\"plant\":{\"denominator\":[1,6.1,8.08,2.64],\"b\":1.0},\"spec\":@}",
                    "/spec",
                    "settlingTime",
                    "1.0",
                    "\"overshootPercent\":5.0"),
            new Host(
                    "/v1/verifications",
                    "{\"plant\":@,\"gain\":{\"k1\":1.5723,\"k2\":0.0992069,\"referenceGain\":1.5723}}",
                    "/plant",
                    "a0",
                    "0",
                    "\"a1\":0.48,\"b\":400,\"d\":400"),
            new Host(
                    "/v1/designs/plots/bode",
                    "{\"design\":{\"plant\":" + PLANT + ",\"spec\":@},\"actuatorLimit\":3}",
                    "/design/spec",
                    "settlingTime",
                    "0.15",
                    SPEC_REST),
            new Host(
                    "/v1/designs/controllers/c-source",
                    "{\"design\":{\"plant\":" + PLANT + ",\"spec\":@},\"samplePeriod\":0.001,\"actuatorLimit\":3}",
                    "/design/spec",
                    "settlingTime",
                    "0.15",
                    SPEC_REST),
            new Host(
                    "/v1/designs/batch",
                    "{\"items\":[{\"plant\":" + PLANT + ",\"spec\":@}]}",
                    "/items/0/spec",
                    "settlingTime",
                    "0.15",
                    SPEC_REST),
            new Host(
                    "/v1/models/fit",
                    "{\"samples\":{\"time\":[0,1,2,3,4,5,6,7],\"output\":[0,1,2,3,4,5,6,7],\"input\":@}}",
                    "/samples/input",
                    "x",
                    "1",
                    "\"y\":2"));

    /** Hostile nested values (F stands for the host's number field), each a malformed request. */
    private static final List<String> NESTED = List.of(
            "{\"F\":",
            "{\"F\":1",
            "{\"F\":\"abc",
            "{\"F\":1}}",
            "{\"F\":1}]",
            "{\"F\":[1,2,]}",
            "{\"F\":{\"x\":{\"y\":[1,}}}",
            "{\"F\":{\"x\":{\"y\":1,}}}",
            "{\"F\":{\"x\":1,\"x\":2}}",
            "{\"F\":{\"x\":NaN}}",
            "{\"F\":[NaN]}",
            "{\"F\":tru}",
            "{\"F\":'x'}",
            "{\"F\":0x10}",
            "{\"F\":01}",
            "{\"F\":.5}",
            "{\"F\":1.}",
            "{\"F\":+1}",
            "{F:1}",
            "{\"F\" 1}",
            "{\"F\":1 \"G\":2}",
            "{\"F\":\"\\u00zz\"}",
            "{\"F\":\"\\x\"}",
            "{\"F\":" + "9".repeat(150) + "}",
            "{\"F\":" + "[".repeat(24) + "1" + "]".repeat(24) + "}",
            "{\"F\":\"0.1\"}",
            "{\"F\":true}",
            "{\"F\":{\"deep\":{\"deeper\":[{\"a\":\"b\"}]}}}",
            "{\"F\":1} /* comment */",
            "{\"F\":1,\"F\":{\"F\":1,\"F\":2}}",
            "{\"F\":99999999999999999999999999999}",
            "{\"F\":-Infinity}");

    @Test
    void noParserTextReachesAClientFromAnyJsonEndpoint() {
        int answers = 0;
        for (Host host : HOSTS) {
            for (String nested : NESTED) {
                assertWordedByUs(host, host.body(nested.replace("F", host.field())));
                answers++;
            }
        }
        assertEquals(HOSTS.size() * NESTED.size(), answers);
    }

    /**
     * An unknown member at the start of the request beside each hostile nested value: the decoder goes on past the
     * unknown member (every field error in one answer), and on that path too no parser text reaches a client. A
     * value of the wrong type is named together with the unknown member; a syntax error ends the reading, so only
     * what was reported before it is named with it (a record's unknown members are reported when its object is
     * complete).
     */
    @Test
    void anUnknownMemberBesideEachHostileValueIsNamedWithItAndNoParserTextLeaks() {
        int collected = 0;
        for (Host host : HOSTS) {
            boolean batch = host.path().endsWith("/batch");
            // A batch item's problem points into the item.
            String hostilePointer = batch ? host.pointer().substring("/items/0".length()) : host.pointer();
            for (String nested : NESTED) {
                String hostile = host.body(nested.replace("F", host.field()));
                String body = batch
                        ? hostile.replaceFirst("\\[\\{", "[{\"zzUnknown\":1,")
                        : "{\"zzUnknown\":1," + hostile.substring(1);
                JsonNode problem = assertWordedByUs(host, body);
                if (batch && !problem.path("instance").asText().contains("#/items/")) {
                    continue; // a syntax error of the envelope itself: answered before any item is decoded
                }
                List<String> pointers = new ArrayList<>();
                problem.path("errors")
                        .forEach(error -> pointers.add(error.path("pointer").asText()));
                if (pointers.contains("/zzUnknown")) {
                    assertTrue(
                            // the hostile value's own error (or, for content after the document, the root's)
                            pointers.stream()
                                    .anyMatch(pointer -> pointer.isEmpty() || pointer.startsWith(hostilePointer)),
                            body + " -> " + problem);
                    collected++;
                }
            }
        }
        // At least the wrong types (a string, true, an object) and the too-large whole number, on every host.
        assertTrue(collected >= 4 * HOSTS.size(), "collected " + collected);
    }

    @Test
    void nestedDuplicateNanAndTrailingCommaAreNamedAtTheirOwnPointer() {
        // The fit's nested values are arrays of samples: its leaks are checked above, its pointers by FitEndpointTest.
        for (Host host : HOSTS.subList(0, HOSTS.size() - 1)) {
            String field = "\"" + host.field() + "\":";
            String at = host.pointer() + "/" + host.field();
            List<String[]> cases = new ArrayList<>();
            cases.add(new String[] {
                host.object(field + host.value() + "," + field + host.value() + "," + host.rest()), at, "duplicate key"
            });
            cases.add(new String[] {host.object(field + "NaN," + host.rest()), at, "NaN and Infinity"});
            cases.add(new String[] {host.object(host.rest() + "," + field + host.value() + ","), at, "trailing comma"});
            for (String[] c : cases) {
                JsonNode problem = assertWordedByUs(host, host.body(c[0]));
                assertEquals(c[1], problem.at("/errors/0/pointer").asText(), host.path() + " " + c[0]);
                assertTrue(problem.at("/errors/0/detail").asText().contains(c[2]), problem.toString());
                assertTrue(problem.path("detail").asText().startsWith("field " + c[1] + ": "), problem.toString());
            }
        }
    }

    @Test
    void aTopLevelDuplicateNanAndTrailingCommaAreNamedTheSameWay() {
        String spec = "\"spec\":{\"settlingTime\":0.15,\"overshootPercent\":1.5}";
        String[][] cases = {
            {"{\"plant\":" + PLANT + ",\"plant\":" + PLANT + "," + spec + "}", "/plant", "duplicate key"},
            {"{\"plant\":NaN," + spec + "}", "/plant", "NaN and Infinity"},
            {"{\"plant\":" + PLANT + "," + spec + ",}", "/spec", "trailing comma"},
            {
                "{\"plant\":{\"form\":\"transferFunction\",\"numerator\":[400,NaN],\"denominator\":[1,0.48,0]}," + spec
                        + "}",
                "/plant/numerator/1",
                "NaN and Infinity"
            },
            {
                "{\"plant\":{\"form\":\"transferFunction\",\"numerator\":[400,],\"denominator\":[1,0.48,0]}," + spec
                        + "}",
                "/plant/numerator/1",
                "trailing comma"
            },
        };
        Host designs = HOSTS.get(0);
        for (String[] c : cases) {
            JsonNode problem = assertWordedByUs(designs, c[0]);
            assertEquals(c[1], problem.at("/errors/0/pointer").asText(), c[0]);
            assertTrue(problem.at("/errors/0/detail").asText().contains(c[2]), problem.toString());
        }
    }

    private static JsonNode assertWordedByUs(Host host, String body) {
        LiveServer.Reply reply = server.post(host.path(), body);
        String context = host.path() + " " + body + " -> " + reply.text();
        String requestId = reply.headers().firstValue("X-Request-Id").orElseThrow();
        JsonNode problem;
        String instance = "/requests/" + requestId;
        if (reply.status() == 200 && host.path().endsWith("/batch")) {
            // A well-formed envelope: the item's own problem is its NDJSON line.
            problem = readLine(reply.text()).path("problem");
            assertEquals(400, problem.path("status").asInt(), context);
            instance += "#/items/0";
        } else {
            assertEquals(400, reply.status(), context);
            assertEquals("application/problem+json", reply.contentType(), context);
            problem = reply.json();
        }
        List<String> texts = new ArrayList<>();
        texts.add(problem.path("detail").asText());
        problem.path("errors").forEach(error -> texts.add(error.path("detail").asText()));
        for (String text : texts) {
            for (String parser : PARSER_TEXT) {
                assertFalse(text.contains(parser), "parser text '" + parser + "' in " + context);
            }
        }
        assertFalse(problem.path("errors").isEmpty(), context);
        assertEquals(instance, problem.path("instance").asText(), context);
        return problem;
    }

    private static JsonNode readLine(String ndjson) {
        try {
            return new com.fasterxml.jackson.databind.ObjectMapper().readTree(ndjson.strip());
        } catch (java.io.IOException e) {
            throw new AssertionError("not one NDJSON line: " + ndjson, e);
        }
    }
}
