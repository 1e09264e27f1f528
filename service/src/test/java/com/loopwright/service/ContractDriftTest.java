package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.request.DesignRequest;
import com.loopwright.api.request.FieldLimits;
import com.loopwright.api.response.DesignResponse;
import com.loopwright.api.exchange.TakeawayExchange;
import com.loopwright.api.plot.Figure;
import com.loopwright.api.request.ControllerRequest;
import com.loopwright.api.request.PlotRequest;
import com.loopwright.api.request.TakeawayLimits;
import com.loopwright.api.response.ControllerParameters;
import io.swagger.v3.parser.OpenAPIV3Parser;
import io.swagger.v3.parser.core.models.SwaggerParseResult;
import java.lang.reflect.ParameterizedType;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** openapi.yaml, the code and the README must say the same thing; this test fails when they drift. */
class ContractDriftTest {

    private final Contract contract = Contract.load();

    @Test
    void contractParsesAsOpenApi31WithoutMessages() throws Exception {
        SwaggerParseResult result = new OpenAPIV3Parser().readContents(Files.readString(Contract.FILE));
        assertTrue(result.getMessages() == null || result.getMessages().isEmpty(), "parser: " + result.getMessages());
        assertEquals("3.1.0", result.getOpenAPI().getOpenapi());
    }

    @Test
    void requestSchemasMatchTheRequestRecords() {
        assertRecordMatchesSchema(DesignRequest.class, contract.component("DesignRequest"), "DesignRequest");
    }

    @Test
    void responseSchemaMatchesTheResponseRecords() {
        assertRecordMatchesSchema(DesignResponse.class, contract.component("DesignResponse"), "DesignResponse");
    }

    @Test
    void documentedRangesMatchTheValidator() {
        Map<String, Double> expected = Map.ofEntries(
                Map.entry("PlantInput/properties/a0/maximum", FieldLimits.MAX_ABS_A0),
                Map.entry("PlantInput/properties/a0/minimum", -FieldLimits.MAX_ABS_A0),
                Map.entry("PlantInput/properties/a1/maximum", FieldLimits.MAX_ABS_A1),
                Map.entry("PlantInput/properties/a1/minimum", -FieldLimits.MAX_ABS_A1),
                Map.entry("PlantInput/properties/b/maximum", FieldLimits.MAX_ABS_B),
                Map.entry("PlantInput/properties/d/maximum", FieldLimits.MAX_ABS_D),
                Map.entry("SpecInput/properties/settlingTime/minimum", FieldLimits.MIN_TIME_SECONDS),
                Map.entry("SpecInput/properties/settlingTime/maximum", FieldLimits.MAX_TIME_SECONDS),
                Map.entry("SpecInput/properties/riseTime/minimum", FieldLimits.MIN_TIME_SECONDS),
                Map.entry("SpecInput/properties/riseTime/maximum", FieldLimits.MAX_TIME_SECONDS),
                Map.entry("SpecInput/properties/overshootPercent/minimum", FieldLimits.MIN_OVERSHOOT_PERCENT),
                Map.entry("SpecInput/properties/overshootPercent/maximum", FieldLimits.MAX_OVERSHOOT_PERCENT),
                Map.entry("SpecInput/properties/settlingBandPercent/minimum", FieldLimits.MIN_BAND_PERCENT),
                Map.entry("SpecInput/properties/settlingBandPercent/maximum", FieldLimits.MAX_BAND_PERCENT),
                Map.entry("SpecInput/properties/settlingBandPercent/default", FieldLimits.DEFAULT_BAND_PERCENT),
                Map.entry("SpecInput/properties/gamma/maximum", FieldLimits.MAX_GAMMA),
                Map.entry("SpecInput/properties/gammaMargin/maximum", FieldLimits.MAX_GAMMA_MARGIN),
                Map.entry("SpecInput/properties/gammaMargin/default", FieldLimits.DEFAULT_GAMMA_MARGIN),
                Map.entry("SpecInput/properties/stepSize/maximum", FieldLimits.MAX_ABS_STEP),
                Map.entry("SpecInput/properties/stepSize/default", FieldLimits.DEFAULT_STEP));
        expected.forEach((pointer, value) -> {
            JsonNode node = contract.document().at("/components/schemas/" + pointer);
            assertTrue(node.isNumber(), "openapi.yaml lacks " + pointer);
            assertEquals(value, node.asDouble(), 0, pointer);
        });
    }

    @Test
    void everyDocumentedOperationIsServed() {
        try (LiveServer server = LiveServer.start()) {
            Iterator<Map.Entry<String, JsonNode>> paths = contract.document().get("paths").fields();
            while (paths.hasNext()) {
                Map.Entry<String, JsonNode> path = paths.next();
                for (Iterator<String> methods = path.getValue().fieldNames(); methods.hasNext(); ) {
                    String method = methods.next();
                    String concrete = concretePath(path.getKey(), path.getValue().get(method));
                    var reply = method.equals("get") ? server.get(concrete) : server.post(concrete, "{}");
                    assertNotEquals(404, reply.status(), method + " " + path.getKey());
                    assertNotEquals(405, reply.status(), method + " " + path.getKey());
                }
            }
        }
    }

    @Test
    void readmeExampleIsTheContractExampleAndNamesEveryPath() throws Exception {
        String readme = Files.readString(Path.of("..", "README.md"));
        Matcher block = Pattern.compile("```json\\s*\\n(\\{\"plant\".*?)\\n```", Pattern.DOTALL).matcher(readme);
        assertTrue(block.find(), "README has a ```json request example");
        ObjectMapper json = new ObjectMapper();
        assertEquals(contract.document().at("/paths/~1v1~1designs/post/requestBody/content/application~1json"
                + "/examples/indexingAxis/value"), json.readTree(block.group(1)), "README example = contract example");
        contract.document().get("paths").fieldNames().forEachRemaining(
                path -> assertTrue(readme.contains(path), "README does not mention " + path));
    }

    @Test
    void ciRunsTheReadmeTestCommand() throws Exception {
        String readme = Files.readString(Path.of("..", "README.md"));
        Matcher command = Pattern.compile("Run all tests:\\s*\\n+```(?:sh|bash)?\\s*\\n(.+?)\\n```").matcher(readme);
        assertTrue(command.find(), "README gives the test command under 'Run all tests:'");
        assertTrue(Files.readString(Path.of("..", ".ci", "run")).contains(command.group(1).trim()),
                ".ci/run calls the README's test command: " + command.group(1));
    }

    /** A templated path with each {parameter} replaced by the first value of its documented enum. */
    private static String concretePath(String template, JsonNode operation) {
        String concrete = template;
        JsonNode parameters = operation.path("parameters");
        for (JsonNode parameter : parameters) {
            if ("path".equals(parameter.path("in").asText())) {
                concrete = concrete.replace("{" + parameter.get("name").asText() + "}",
                        parameter.at("/schema/enum/0").asText());
            }
        }
        assertFalse(concrete.contains("{"), "every path parameter of " + template + " has an enum");
        return concrete;
    }

    @Test
    void takeawaySchemasMatchTheirRecordsAndLimits() {
        assertRecordMatchesSchema(PlotRequest.class, contract.component("PlotRequest"), "PlotRequest");
        assertRecordMatchesSchema(ControllerRequest.class, contract.component("ControllerRequest"), "ControllerRequest");
        assertRecordMatchesSchema(ControllerParameters.class, contract.component("ControllerParameters"),
                "ControllerParameters");
        Map<String, Double> expected = Map.of(
                "ControllerRequest/properties/samplePeriodSeconds/minimum", TakeawayLimits.MIN_SAMPLE_PERIOD_SECONDS,
                "ControllerRequest/properties/samplePeriodSeconds/maximum", TakeawayLimits.MAX_SAMPLE_PERIOD_SECONDS,
                "ControllerRequest/properties/commandLimit/maximum", TakeawayLimits.MAX_COMMAND_LIMIT,
                "PlotRequest/properties/commandLimit/maximum", TakeawayLimits.MAX_COMMAND_LIMIT);
        expected.forEach((pointer, value) -> {
            JsonNode node = contract.document().at("/components/schemas/" + pointer);
            assertTrue(node.isNumber(), "openapi.yaml lacks " + pointer);
            assertEquals(value, node.asDouble(), 0, pointer);
        });
        assertEquals(TakeawayExchange.FORMATS.size(), contract.document()
                .at("/paths/~1v1~1designs~1controllers~1{format}/post/parameters/0/schema/enum").size());
        for (int i = 0; i < TakeawayExchange.FORMATS.size(); i++) {
            assertEquals(TakeawayExchange.FORMATS.get(i), contract.document()
                    .at("/paths/~1v1~1designs~1controllers~1{format}/post/parameters/0/schema/enum/" + i).asText());
        }
        JsonNode figures = contract.document().at("/paths/~1v1~1designs~1plots~1{figure}/post/parameters/0/schema/enum");
        assertEquals(Figure.values().length, figures.size());
        for (Figure figure : Figure.values()) {
            assertEquals(figure.slug(), figures.get(figure.ordinal()).asText());
        }
    }

    /** Record components and schema properties must be the same names, recursively. */
    private void assertRecordMatchesSchema(Class<?> type, JsonNode schema, String where) {
        schema = resolve(schema);
        Set<String> components = new TreeSet<>();
        for (RecordComponent component : type.getRecordComponents()) {
            components.add(component.getName());
        }
        Set<String> properties = new TreeSet<>();
        schema.get("properties").fieldNames().forEachRemaining(properties::add);
        assertEquals(components, properties, "fields of " + where);
        assertEquals(false, schema.path("additionalProperties").asBoolean(true), where + " is closed");
        for (RecordComponent component : type.getRecordComponents()) {
            JsonNode property = resolve(schema.get("properties").get(component.getName()));
            Class<?> componentType = component.getType();
            String path = where + "." + component.getName();
            if (componentType.isRecord()) {
                assertRecordMatchesSchema(componentType, property, path);
            } else if (java.util.List.class.isAssignableFrom(componentType)) {
                assertEquals("array", property.get("type").asText(), path);
                assertTrue(property.has("maxItems"), path + " has a documented cap");
                Type element = ((ParameterizedType) component.getGenericType()).getActualTypeArguments()[0];
                if (element instanceof Class<?> elementClass && elementClass.isRecord()) {
                    assertRecordMatchesSchema(elementClass, property.get("items"), path + "[]");
                }
            } else {
                assertEquals(jsonType(componentType), property.get("type").asText(), path);
            }
        }
    }

    private JsonNode resolve(JsonNode schema) {
        JsonNode ref = schema.get("$ref");
        return ref == null ? schema : contract.document().at(ref.asText().substring(1));
    }

    private static String jsonType(Class<?> type) {
        if (type == double.class || type == Double.class) {
            return "number";
        }
        if (type == int.class || type == Integer.class || type == long.class) {
            return "integer";
        }
        if (type == boolean.class || type == Boolean.class) {
            return "boolean";
        }
        if (type == String.class) {
            return "string";
        }
        throw new AssertionError("no JSON type for " + type);
    }
}
