package com.loopwright.service;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.loopwright.api.design.DesignRequest;
import com.loopwright.api.design.DesignResponse;
import com.loopwright.api.fit.FitLimits;
import com.loopwright.api.fit.FitRequest;
import com.loopwright.api.fit.FitResponse;
import com.loopwright.api.highorder.HighOrderDesignRequest;
import com.loopwright.api.highorder.HighOrderDesignResponse;
import com.loopwright.api.highorder.HighOrderLimits;
import com.loopwright.api.loop.LoopCheck;
import com.loopwright.api.loop.LoopLimits;
import com.loopwright.api.plant.PlantFormName;
import com.loopwright.api.plant.PlantInput;
import com.loopwright.api.plot.Figure;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.api.robustness.VerifyLimits;
import com.loopwright.api.takeaway.ActuatorRange;
import com.loopwright.api.takeaway.ControllerParameters;
import com.loopwright.api.takeaway.ControllerRequest;
import com.loopwright.api.takeaway.OperatingPoint;
import com.loopwright.api.takeaway.PlotRequest;
import com.loopwright.api.takeaway.TakeawayLimits;
import com.loopwright.api.takeaway.Takeaways;
import com.loopwright.api.validation.FieldLimits;
import com.loopwright.api.verification.VerificationRequest;
import com.loopwright.api.verification.VerificationResponse;
import com.loopwright.solver.frequency.LoopFrequencyAnalyzer;
import com.loopwright.solver.highorder.PoleMatchedRiccati;
import com.loopwright.solver.highorder.SpecMatcher;
import com.loopwright.solver.plant.FitWarning;
import com.loopwright.solver.robustness.RobustnessVerifier;
import com.loopwright.solver.robustness.UncertaintyAnalyzer;
import io.swagger.v3.parser.OpenAPIV3Parser;
import io.swagger.v3.parser.core.models.SwaggerParseResult;
import java.lang.reflect.ParameterizedType;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
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

    /**
     * One name for one quantity (common practice for a public contract): no schema property anywhere in the contract
     * uses a synonym of a name the contract already gives that quantity. Each pair is (synonym, the contract's name).
     */
    @Test
    void everyQuantityHasOneNameAcrossTheContract() {
        Map<String, String> synonyms = Map.of(
                "peakCommand", "peakControl",
                "stateGain", "k",
                "commandLimit", "actuatorLimit",
                "samplePeriodSeconds", "samplePeriod",
                "hinfNorm", "peakDisturbanceGain",
                "peakFrequency", "peakDisturbanceGainFrequency",
                "gammaLowerBoundValue", "gammaLowerBound");
        List<String> found = new ArrayList<>();
        collectPropertyNames(contract.document(), "", synonyms, found);
        assertEquals(List.of(), found, "synonyms of names the contract already uses");
    }

    private static void collectPropertyNames(
            JsonNode node, String at, Map<String, String> synonyms, List<String> found) {
        if (node.isObject()) {
            JsonNode properties = node.get("properties");
            if (properties != null && properties.isObject()) {
                properties.fieldNames().forEachRemaining(name -> {
                    if (synonyms.containsKey(name)) {
                        found.add(at + "/properties/" + name + " (use " + synonyms.get(name) + ")");
                    }
                });
            }
            node.fields()
                    .forEachRemaining(e -> collectPropertyNames(e.getValue(), at + "/" + e.getKey(), synonyms, found));
        } else if (node.isArray()) {
            for (int i = 0; i < node.size(); i++) {
                collectPropertyNames(node.get(i), at + "/" + i, synonyms, found);
            }
        }
    }

    @Test
    void requestSchemasMatchTheRequestRecords() {
        assertRecordMatchesSchema(DesignRequest.class, contract.component("DesignRequest"), "DesignRequest");
        assertRecordMatchesSchema(FitRequest.class, contract.component("FitRequest"), "FitRequest");
        assertRecordMatchesSchema(
                com.loopwright.api.designspace.DesignSpaceRequest.class,
                contract.component("DesignSpaceRequest"),
                "DesignSpaceRequest");
        assertRecordMatchesSchema(
                VerificationRequest.class, contract.component("VerificationRequest"), "VerificationRequest");
    }

    @Test
    void fitResponseSchemaMatchesTheFitResponseRecords() {
        assertTracedResponseMatchesSchema(FitResponse.class, contract.component("FitResponse"), "FitResponse");
    }

    @Test
    void plantFormsAndProblemTypesMatchTheContract() {
        Set<String> documented = new TreeSet<>();
        contract.component("PlantModel").at("/properties/form/enum").forEach(n -> documented.add(n.asText()));
        assertEquals(new TreeSet<>(PlantFormName.wireNames()), documented, "PlantModel.form enum");
        Set<String> branches = new TreeSet<>();
        contract.component("PlantDescription")
                .get("oneOf")
                .forEach(branch -> resolve(branch).at("/properties/form/enum").forEach(n -> branches.add(n.asText())));
        assertEquals(documented, branches, "one PlantDescription branch per form");
        for (PlantFormName form : PlantFormName.values()) {
            for (JsonNode branch : contract.component("PlantDescription").get("oneOf")) {
                JsonNode resolved = resolve(branch);
                if (resolved.at("/properties/form/enum/0").asText().equals(form.wireName())) {
                    Set<String> fields = new TreeSet<>();
                    resolved.get("properties").fieldNames().forEachRemaining(fields::add);
                    fields.remove("form");
                    assertEquals(new TreeSet<>(form.fields()), fields, "fields of " + form.wireName());
                }
            }
        }
        Set<String> types = documentedProblemTypes();
        Set<String> emitted = new TreeSet<>();
        for (ProblemType type : ProblemType.values()) {
            emitted.add(type.uri());
        }
        assertEquals(emitted, types, "Problem.type enum");
        Set<String> warnings = new TreeSet<>();
        contract.schemaAt("FitResponse/properties/warnings/items/properties/code/enum")
                .forEach(n -> warnings.add(n.asText()));
        assertEquals(FitWarning.Code.values().length, warnings.size(), "FitResponse warning codes");
    }

    @Test
    void highOrderSchemasMatchTheHighOrderRecords() {
        assertRecordMatchesSchema(
                HighOrderDesignRequest.class, contract.component("HighOrderDesignRequest"), "HighOrderDesignRequest");
        assertTracedResponseMatchesSchema(
                HighOrderDesignResponse.class,
                contract.component("HighOrderDesignResponse"),
                "HighOrderDesignResponse");
    }

    /** The loop fields (issue 16): one validator, the same ranges and defaults in both design requests. */
    @Test
    void loopFieldRangesMatchTheValidator() {
        for (String request : List.of("DesignRequest/properties/", "HighOrderDesignRequest/properties/")) {
            assertDocumented(request + "integralPoleMultiple/minimum", LoopLimits.MIN_INTEGRAL_POLE_MULTIPLE);
            assertDocumented(request + "integralPoleMultiple/maximum", LoopLimits.MAX_INTEGRAL_POLE_MULTIPLE);
            assertDocumented(request + "integralPoleMultiple/default", LoopLimits.DEFAULT_INTEGRAL_POLE_MULTIPLE);
            assertDocumented(request + "loadStepSize/default", LoopLimits.DEFAULT_LOAD_STEP);
        }
        assertDocumented("VerificationRequest/properties/loadStepSize/default", LoopLimits.DEFAULT_LOAD_STEP);
        String observer = "ObserverInput/properties/";
        assertDocumented(observer + "multiple/minimum", LoopLimits.MIN_OBSERVER_MULTIPLE);
        assertDocumented(observer + "multiple/maximum", LoopLimits.MAX_OBSERVER_MULTIPLE);
        assertDocumented(observer + "multiple/default", LoopLimits.DEFAULT_OBSERVER_MULTIPLE);
        assertDocumented(observer + "processNoise/minimum", LoopLimits.MIN_NOISE_INTENSITY);
        assertDocumented(observer + "processNoise/maximum", LoopLimits.MAX_NOISE_INTENSITY);
        assertDocumented(observer + "measurementNoise/minimum", LoopLimits.MIN_NOISE_INTENSITY);
        assertDocumented(observer + "measurementNoise/maximum", LoopLimits.MAX_NOISE_INTENSITY);
        assertDocumented(observer + "sensorResolution/minimum", LoopLimits.MIN_SENSOR_RESOLUTION);
        assertDocumented(observer + "sensorResolution/maximum", LoopLimits.MAX_SENSOR_RESOLUTION);
        assertDocumented(observer + "samplePeriod/minimum", LoopLimits.MIN_SAMPLE_PERIOD);
        assertDocumented(observer + "samplePeriod/maximum", LoopLimits.MAX_SAMPLE_PERIOD);
        assertRecordMatchesSchema(LoopCheck.class, contract.component("LoopCheck"), "LoopCheck");
    }

    @Test
    void highOrderRangesMatchTheValidator() {
        String request = "HighOrderDesignRequest/properties/";
        Map<String, Double> expected = Map.ofEntries(
                Map.entry(request + "plant/properties/denominator/maxItems", (double) HighOrderLimits.MAX_ORDER + 1),
                Map.entry(request + "plant/properties/denominator/minItems", (double) HighOrderLimits.MIN_ORDER + 1),
                Map.entry(request + "plant/properties/denominator/items/maximum", HighOrderLimits.MAX_ABS_COEFFICIENT),
                Map.entry(request + "plant/properties/numerator/items/maximum", HighOrderLimits.MAX_ABS_COEFFICIENT),
                Map.entry(request + "plant/properties/disturbance/items/maximum", HighOrderLimits.MAX_ABS_DISTURBANCE),
                Map.entry(request + "plant/properties/b/maximum", FieldLimits.MAX_ABS_B),
                Map.entry(
                        request + "spec/properties/maxUndershootPercent/minimum",
                        HighOrderLimits.MIN_UNDERSHOOT_PERCENT),
                Map.entry(
                        request + "spec/properties/maxUndershootPercent/maximum",
                        HighOrderLimits.MAX_UNDERSHOOT_PERCENT),
                Map.entry(
                        request + "spec/properties/maxUndershootPercent/default",
                        HighOrderLimits.DEFAULT_MAX_UNDERSHOOT_PERCENT),
                Map.entry(request + "spec/properties/settlingTime/minimum", FieldLimits.MIN_TIME_SECONDS),
                Map.entry(request + "spec/properties/settlingTime/maximum", FieldLimits.MAX_TIME_SECONDS),
                Map.entry(
                        request + "auxiliaryPoles/properties/realPartMultiple/minimum",
                        HighOrderLimits.MIN_REAL_PART_MULTIPLE),
                Map.entry(
                        request + "auxiliaryPoles/properties/realPartMultiple/maximum",
                        HighOrderLimits.MAX_REAL_PART_MULTIPLE),
                Map.entry(
                        request + "auxiliaryPoles/properties/realPartMultiple/default",
                        HighOrderLimits.DEFAULT_REAL_PART_MULTIPLE),
                Map.entry(
                        request + "auxiliaryPoles/properties/poles/maxItems", (double) (HighOrderLimits.MAX_ORDER - 2)),
                Map.entry(
                        request + "auxiliaryPoles/properties/poles/items/properties/re/minimum",
                        -HighOrderLimits.MAX_POLE_MAGNITUDE),
                Map.entry("HighOrderDesignResponse/properties/specMatching/properties/iterations/maximum", (double)
                        SpecMatcher.MAX_ITERATIONS),
                Map.entry(
                        "RiccatiSolution/properties/newtonSteps/maximum", (double) PoleMatchedRiccati.MAX_NEWTON_STEPS),
                Map.entry("HighOrderUncertaintyInput/properties/monteCarloSamples/maximum", (double)
                        com.loopwright.solver.pipeline.HighOrderRobustPipeline.MAX_SAMPLES),
                Map.entry(
                        "HighOrderUncertaintyInput/properties/denominator/maxItems",
                        (double) HighOrderLimits.MAX_ORDER + 1),
                Map.entry("HighOrderRobustDesign/properties/corners/maxItems", (double)
                        (1 << com.loopwright.solver.robustness.CompanionBox.MAX_RANGED)),
                Map.entry(
                        "HighOrderRobustDesignInput/properties/actuatorLimit/maximum",
                        com.loopwright.api.robustness.VerifyLimits.MAX_ACTUATOR_LIMIT));
        expected.forEach((pointer, value) -> {
            assertDocumented(pointer, value);
        });
    }

    @Test
    void responseSchemaMatchesTheResponseRecords() {
        assertTracedResponseMatchesSchema(DesignResponse.class, contract.component("DesignResponse"), "DesignResponse");
        assertTracedResponseMatchesSchema(
                VerificationResponse.class, contract.component("VerificationResponse"), "VerificationResponse");
        assertTracedResponseMatchesSchema(
                com.loopwright.api.designspace.DesignSpaceResponse.class,
                contract.component("DesignSpaceResponse"),
                "DesignSpaceResponse");
    }

    @Test
    void documentedDesignSpaceCapsMatchTheCode() {
        int axis = com.loopwright.solver.pipeline.DesignSpacePipeline.MAX_AXIS_POINTS;
        int samples = com.loopwright.solver.pipeline.DesignSpacePipeline.MAX_BOX_SAMPLES;
        assertDocumented("DesignSpaceResponse/properties/cells/maxItems", (double) axis * axis);
        assertDocumented("DesignSpaceResponse/properties/fastest/maxItems", (double) axis);
        assertTrue(contract.component("DesignSpaceAxis")
                .at("/properties/count/description")
                .asText()
                .contains("cap " + axis));
        String description = contract.document()
                .at("/paths/~1v1~1design-spaces/post/description")
                .asText();
        assertTrue(description.contains(axis + " points per axis (at most " + axis + " x " + axis + " cells)"));
        assertTrue(description.replace('\n', ' ').contains(samples + " box samples"), description);
        // the cost model: the largest map the caps allow stays within the per-request budget
        long largest = com.loopwright.api.design.ComputeBudget.designSpaceUnits((long) axis * axis, 16 + samples);
        assertEquals(13_435, largest); // 4096 cells x (2 + 80) evaluations / 25, by hand
        assertTrue(largest <= com.loopwright.api.design.ComputeBudget.MAX_REQUEST_WORK_UNITS);
    }

    @Test
    void documentedVerifyCapsMatchTheCode() {
        Map<String, Double> expected = Map.ofEntries(
                Map.entry("UncertaintyInput/properties/monteCarloSamples/maximum", (double)
                        VerifyLimits.MAX_MONTE_CARLO_SAMPLES),
                Map.entry("UncertaintyInput/properties/monteCarloSamples/maximum#solver", (double)
                        UncertaintyAnalyzer.MAX_SAMPLES),
                Map.entry("VerifyInput/properties/disturbances/maxItems", (double) VerifyLimits.MAX_DISTURBANCES),
                Map.entry("VerifyInput/properties/frequencyPoints/maximum", (double) VerifyLimits.MAX_FREQUENCY_POINTS),
                Map.entry("VerifyInput/properties/frequencyPoints/maximum#solver", (double)
                        LoopFrequencyAnalyzer.MAX_RESPONSE_POINTS),
                Map.entry("VerifyInput/properties/timeSeriesPoints/maximum", (double)
                        VerifyLimits.MAX_TIME_SERIES_POINTS),
                Map.entry("VerifyInput/properties/timeSeriesPoints/minimum", (double)
                        VerifyLimits.MIN_TIME_SERIES_POINTS),
                Map.entry("VerifyInput/properties/tolerancePercent/maximum", VerifyLimits.MAX_TOLERANCE_PERCENT),
                Map.entry("VerifyInput/properties/tolerancePercent/default", VerifyLimits.DEFAULT_TOLERANCE_PERCENT),
                Map.entry("VerifyInput/properties/actuatorLimit/maximum", VerifyLimits.MAX_ACTUATOR_LIMIT),
                Map.entry("VerifyInput/properties/inputDelay/maximum", VerifyLimits.MAX_TIME_SECONDS),
                Map.entry("ParameterRangeInput/properties/spreadPercent/maximum", VerifyLimits.MAX_SPREAD_PERCENT),
                Map.entry("SamplingInput/properties/samplePeriod/minimum", VerifyLimits.MIN_SAMPLE_PERIOD),
                Map.entry("DisturbanceInput/properties/frequency/maximum", VerifyLimits.MAX_FREQUENCY),
                Map.entry("DisturbanceInput/properties/amplitude/maximum", VerifyLimits.MAX_ABS_AMPLITUDE),
                Map.entry("GainInput/properties/k1/maximum", VerifyLimits.MAX_ABS_GAIN),
                Map.entry("RobustnessResponse/properties/margins/properties/response/maxItems", (double)
                        VerifyLimits.MAX_FREQUENCY_POINTS),
                Map.entry("RobustnessResponse/properties/timeSeries/items/properties/points/maxItems", (double)
                        VerifyLimits.MAX_TIME_SERIES_POINTS),
                Map.entry(
                        "RobustnessResponse/properties/disturbances/maxItems", (double) VerifyLimits.MAX_DISTURBANCES));
        expected.forEach((key, value) -> {
            assertDocumented(key.replace("#solver", ""), value);
        });
        // the caps that only the computation knows are stated in the operation description
        String description = contract.document()
                .at("/paths/~1v1~1verifications/post/description")
                .asText();
        assertTrue(description.contains(String.valueOf(UncertaintyAnalyzer.MAX_SAMPLES)));
        assertTrue(description.contains("200000"), "sample interval cap");
        assertTrue(description.contains(fmt(RobustnessVerifier.MAX_DISTURBANCE_TIMING_HORIZONS) + " nominal horizons"));
        assertTrue(description.contains(fmt(RobustnessVerifier.MAX_DELAY_HORIZONS) + " nominal horizon"));
    }

    /**
     * A documented number at a schema path (through $refs). A path ending in /default names a default the server
     * applies: the contract states it in the field's description in words ("default 2"), never as a `default:`
     * keyword (a generated client would otherwise send it as if the caller had).
     */
    private void assertDocumented(String pointer, double value) {
        if (pointer.endsWith("/default")) {
            String field = pointer.substring(0, pointer.length() - "/default".length());
            String description = contract.resolve(contract.schemaAt(field))
                    .path("description")
                    .asText();
            String number = value == Math.rint(value) ? fmt(value) : String.valueOf(value);
            assertTrue(
                    Pattern.compile("(?i)\\bdefault:? " + Pattern.quote(number) + "(?![0-9.]*[0-9])")
                            .matcher(description)
                            .find(),
                    field + " states its default " + number + " in words: " + description);
            return;
        }
        JsonNode node = contract.schemaAt(pointer);
        assertTrue(node.isNumber(), "openapi.yaml lacks " + pointer);
        assertEquals(value, node.asDouble(), 0, pointer);
    }

    private static String fmt(double value) {
        return String.valueOf((long) value);
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
                Map.entry("SpecInput/properties/stepSize/default", FieldLimits.DEFAULT_STEP),
                Map.entry("RotaryAxisPlant/properties/inertia/maximum", FieldLimits.MAX_ABS_PHYSICAL),
                Map.entry("MassSpringDamperPlant/properties/mass/maximum", FieldLimits.MAX_ABS_PHYSICAL),
                Map.entry("TransferFunctionPlant/properties/gain/maximum", FieldLimits.MAX_ABS_PHYSICAL),
                Map.entry("TransferFunctionPlant/properties/numerator/maxItems", (double)
                        FieldLimits.MAX_NUMERATOR_COEFFICIENTS),
                Map.entry("StateSpacePlant/properties/b2/items/maximum", FieldLimits.MAX_ABS_PHYSICAL),
                Map.entry("FitRequest/properties/samples/properties/time/maxItems", (double) FitLimits.MAX_SAMPLES),
                Map.entry("FitRequest/properties/samples/properties/time/minItems", (double) FitLimits.MIN_SAMPLES),
                Map.entry("FitRequest/properties/samples/properties/output/maxItems", (double) FitLimits.MAX_SAMPLES),
                Map.entry("FitRequest/properties/samples/properties/input/maxItems", (double) FitLimits.MAX_SAMPLES),
                Map.entry(
                        "FitRequest/properties/samples/properties/time/items/maximum", FitLimits.MAX_ABS_TIME_SECONDS),
                Map.entry("FitRequest/properties/samples/properties/output/items/maximum", FitLimits.MAX_ABS_SIGNAL));
        expected.forEach((pointer, value) -> {
            assertDocumented(pointer, value);
        });
    }

    /**
     * What a client generator needs (issue 15): every object schema below a component or an operation is a named
     * component (a $ref), every number says `format: double` and every integer int32 or int64, and no schema
     * carries a `default:` (a default the server applies is stated in the description; see assertDocumented).
     */
    @Test
    void schemasAreGeneratorReady() {
        java.util.List<String> findings = new java.util.ArrayList<>();
        contract.document()
                .at("/components/schemas")
                .fields()
                .forEachRemaining(component -> inspectSchema(component.getValue(), component.getKey(), true, findings));
        contract.document()
                .get("paths")
                .fields()
                .forEachRemaining(path -> path.getValue()
                        .fields()
                        .forEachRemaining(operation -> operation
                                .getValue()
                                .findParents("schema")
                                .forEach(parent -> inspectSchema(
                                        parent.get("schema"),
                                        path.getKey() + " " + operation.getKey(),
                                        false,
                                        findings))));
        assertEquals(java.util.List.of(), findings);
    }

    private static void inspectSchema(JsonNode schema, String where, boolean top, java.util.List<String> findings) {
        if (!schema.isObject() || schema.has("$ref")) {
            return;
        }
        String type = schema.path("type").asText("");
        if (!top && type.equals("object")) {
            findings.add(where + ": inline object schema (name it under components/schemas)");
        }
        if (type.equals("number") && !schema.path("format").asText().equals("double")) {
            findings.add(where + ": number without format double");
        }
        if (type.equals("integer")
                && !Set.of("int32", "int64").contains(schema.path("format").asText())) {
            findings.add(where + ": integer without format int32/int64");
        }
        if (schema.has("default")) {
            findings.add(where + ": default keyword (state the default in the description)");
        }
        schema.path("properties")
                .fields()
                .forEachRemaining(p -> inspectSchema(p.getValue(), where + "." + p.getKey(), false, findings));
        for (String key : new String[] {"items", "additionalProperties", "if", "then", "else", "not"}) {
            inspectSchema(schema.path(key), where + "/" + key, false, findings);
        }
        for (String key : new String[] {"oneOf", "anyOf", "allOf"}) {
            for (JsonNode branch : schema.path(key)) {
                // a branch of bare constraints (required, const) is no object schema of its own
                inspectSchema(branch, where + "/" + key, !branch.has("properties"), findings);
            }
        }
    }

    /** SpecInput states "exactly one of settlingTime or riseTime" in the schema itself (JSON Schema 2020-12). */
    @Test
    void specSchemaRequiresExactlyOneTimeSpec() throws Exception {
        ObjectMapper json = new ObjectMapper();
        com.networknt.schema.JsonSchema spec = contract.componentSchema("SpecInput");
        assertTrue(spec.validate(json.readTree("{\"settlingTime\": 0.15, \"overshootPercent\": 1.5}"))
                .isEmpty());
        assertTrue(spec.validate(json.readTree("{\"riseTime\": 0.05, \"overshootPercent\": 1.5}"))
                .isEmpty());
        assertFalse(spec.validate(json.readTree("{\"overshootPercent\": 1.5}")).isEmpty(), "neither");
        assertFalse(
                spec.validate(json.readTree("{\"settlingTime\": 0.15, \"riseTime\": 0.05, \"overshootPercent\": 1.5}"))
                        .isEmpty(),
                "both");
        // and the service refuses the same two at the same field (400)
        try (LiveServer server = LiveServer.start()) {
            String plant = "{\"form\": \"canonical\", \"a0\": 0, \"a1\": 0.48, \"b\": 400, \"d\": 400}";
            assertEquals(
                    400,
                    server.post("/v1/designs", "{\"plant\": " + plant + ", \"spec\": {\"overshootPercent\": 1.5}}")
                            .status(),
                    "neither");
            assertEquals(
                    400,
                    server.post(
                                    "/v1/designs",
                                    "{\"plant\": " + plant
                                            + ", \"spec\": {\"settlingTime\": 0.15, \"riseTime\": 0.05, \"overshootPercent\": 1.5}}")
                            .status(),
                    "both");
        }
    }

    @Test
    void everyDocumentedOperationIsServed() {
        try (LiveServer server = LiveServer.start()) {
            Iterator<Map.Entry<String, JsonNode>> paths =
                    contract.document().get("paths").fields();
            while (paths.hasNext()) {
                Map.Entry<String, JsonNode> path = paths.next();
                for (Iterator<String> methods = path.getValue().fieldNames(); methods.hasNext(); ) {
                    String method = methods.next();
                    String concrete =
                            concretePath(path.getKey(), path.getValue().get(method));
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
        Matcher block = Pattern.compile("```json\\s*\\n(\\{\"plant\".*?)\\n```", Pattern.DOTALL)
                .matcher(readme);
        assertTrue(block.find(), "README has a ```json request example");
        ObjectMapper json = new ObjectMapper();
        assertEquals(
                contract.document()
                        .at("/paths/~1v1~1designs/post/requestBody/content/application~1json"
                                + "/examples/indexingAxis/value"),
                json.readTree(block.group(1)),
                "README example = contract example");
        contract.document()
                .get("paths")
                .fieldNames()
                .forEachRemaining(path -> assertTrue(readme.contains(path), "README does not mention " + path));
    }

    @Test
    void ciRunsTheReadmeTestCommand() throws Exception {
        String readme = Files.readString(Path.of("..", "README.md"));
        Matcher command = Pattern.compile("Run all tests:\\s*\\n+```(?:sh|bash)?\\s*\\n(.+?)\\n```")
                .matcher(readme);
        assertTrue(command.find(), "README gives the test command under 'Run all tests:'");
        assertTrue(
                Files.readString(Path.of("..", ".ci", "run"))
                        .contains(command.group(1).trim()),
                ".ci/run calls the README's test command: " + command.group(1));
    }

    @Test
    void batchLineSchemaMatchesTheBatchLineRecordAndTheCap() {
        JsonNode line = contract.component("BatchLine");
        Set<String> components = new TreeSet<>();
        for (RecordComponent component : com.loopwright.service.routes.BatchLine.class.getRecordComponents()) {
            components.add(component.getName());
        }
        Set<String> properties = new TreeSet<>();
        line.get("properties").fieldNames().forEachRemaining(properties::add);
        assertEquals(components, properties, "fields of BatchLine");
        assertEquals(false, line.path("additionalProperties").asBoolean(true), "BatchLine is closed");
        assertEquals("integer", line.at("/properties/index/type").asText());
        assertEquals("integer", line.at("/properties/status/type").asText());
        assertEquals(
                "#/components/schemas/DesignResponse",
                line.at("/properties/design/$ref").asText());
        assertEquals(
                "#/components/schemas/Problem",
                line.at("/properties/problem/$ref").asText());
        assertEquals(
                "#/components/schemas/BatchStreamLine",
                contract.document()
                        .at("/paths/~1v1~1designs~1batch/post"
                                + "/responses/200/content/application~1x-ndjson/schema/$ref")
                        .asText());
        // The stream line: one closed object with the members of both records, BatchCut when resumeFromIndex is
        // present, else BatchLine.
        JsonNode streamLine = contract.component("BatchStreamLine");
        assertEquals("object", streamLine.path("type").asText(), "BatchStreamLine is one object schema");
        assertEquals(false, streamLine.path("additionalProperties").asBoolean(true), "BatchStreamLine is closed");
        Set<String> streamMembers = new TreeSet<>();
        streamLine.get("properties").fieldNames().forEachRemaining(streamMembers::add);
        Set<String> bothRecords = new TreeSet<>(components);
        for (RecordComponent component : com.loopwright.service.routes.BatchCut.class.getRecordComponents()) {
            bothRecords.add(component.getName());
        }
        assertEquals(bothRecords, streamMembers, "fields of BatchStreamLine");
        assertEquals("resumeFromIndex", streamLine.at("/if/required/0").asText());
        assertEquals(
                "#/components/schemas/BatchCut", streamLine.at("/then/$ref").asText());
        assertEquals(
                "#/components/schemas/BatchLine", streamLine.at("/else/$ref").asText());
        JsonNode cut = contract.component("BatchCut");
        Set<String> cutComponents = new TreeSet<>();
        for (RecordComponent component : com.loopwright.service.routes.BatchCut.class.getRecordComponents()) {
            cutComponents.add(component.getName());
            if (component.getType() == int.class) {
                assertEquals(
                        "integer",
                        cut.at("/properties/" + component.getName() + "/type").asText(),
                        "BatchCut." + component.getName());
            }
        }
        Set<String> cutProperties = new TreeSet<>();
        cut.get("properties").fieldNames().forEachRemaining(cutProperties::add);
        assertEquals(cutComponents, cutProperties, "fields of BatchCut");
        assertEquals(false, cut.path("additionalProperties").asBoolean(true), "BatchCut is closed");
        assertEquals(
                "#/components/schemas/Problem",
                cut.at("/properties/problem/$ref").asText());
        assertEquals(
                ServiceConfig.BATCH_ITEMS_CEILING - 1,
                cut.at("/properties/resumeFromIndex/maximum").asInt());
        JsonNode items = contract.component("BatchRequest").at("/properties/items");
        assertEquals(ServiceConfig.BATCH_ITEMS_CEILING, items.get("maxItems").asInt(), "batch cap");
        assertEquals(
                ServiceConfig.BATCH_ITEMS_CEILING - 1,
                line.at("/properties/index/maximum").asInt());
        assertEquals(
                "#/components/schemas/DesignRequest", items.at("/items/$ref").asText());
    }

    /**
     * The problem types listed in the description of Problem.type ("- `uri`" lines): the schema itself is an open
     * string (no enum), so that a new type does not break a client generated from an older contract.
     */
    private Set<String> documentedProblemTypes() {
        JsonNode type = contract.component("Problem").at("/properties/type");
        assertTrue(type.path("enum").isMissingNode(), "Problem.type is an open string, without an enum");
        assertEquals("uri-reference", type.path("format").asText(), "Problem.type format");
        Set<String> documented = new TreeSet<>();
        java.util.regex.Matcher listed = java.util.regex.Pattern.compile("(?m)^- `([^`]+)`")
                .matcher(type.path("description").asText());
        while (listed.find()) {
            documented.add(listed.group(1));
        }
        return documented;
    }

    @Test
    void everyProblemTypeIsDocumented() {
        Set<String> documented = documentedProblemTypes();
        Set<String> emitted = new TreeSet<>();
        for (com.loopwright.api.problem.ProblemType type : com.loopwright.api.problem.ProblemType.values()) {
            emitted.add(type.uri());
        }
        assertEquals(emitted, documented);
    }

    @Test
    void readmeDocumentsEveryConfigurationVariable() throws Exception {
        String readme = Files.readString(Path.of("..", "README.md"));
        for (String variable : ServiceConfig.defaults(0).describe().keySet()) {
            assertTrue(readme.contains("| `" + variable + "` |"), "README's configuration table lacks " + variable);
        }
        assertTrue(readme.contains("| `LOOPWRIGHT_API_KEYS_FILE` |"));
        assertTrue(readme.contains("| `LOOPWRIGHT_LOG_LEVEL` |"));
    }

    /** A templated path with each {parameter} replaced by the first value of its documented enum. */
    private static String concretePath(String template, JsonNode operation) {
        String concrete = template;
        JsonNode parameters = operation.path("parameters");
        for (JsonNode parameter : parameters) {
            if ("path".equals(parameter.path("in").asText())) {
                concrete = concrete.replace(
                        "{" + parameter.get("name").asText() + "}",
                        parameter.at("/schema/enum/0").asText());
            }
        }
        assertFalse(concrete.contains("{"), "every path parameter of " + template + " has an enum");
        return concrete;
    }

    @Test
    void takeawaySchemasMatchTheirRecordsAndLimits() {
        assertRecordMatchesSchema(PlotRequest.class, contract.component("PlotRequest"), "PlotRequest");
        assertRecordMatchesSchema(
                ControllerRequest.class, contract.component("ControllerRequest"), "ControllerRequest");
        assertTracedResponseMatchesSchema(
                ControllerParameters.class, contract.component("ControllerParameters"), "ControllerParameters");
        assertRecordMatchesSchema(ActuatorRange.class, contract.component("ActuatorRange"), "ActuatorRange");
        assertRecordMatchesSchema(OperatingPoint.class, contract.component("OperatingPoint"), "OperatingPoint");
        Map<String, Double> expected = Map.ofEntries(
                Map.entry("ControllerRequest/properties/samplePeriod/minimum", TakeawayLimits.MIN_SAMPLE_PERIOD),
                Map.entry("ControllerRequest/properties/samplePeriod/maximum", TakeawayLimits.MAX_SAMPLE_PERIOD),
                Map.entry("ControllerRequest/properties/actuatorLimit/maximum", TakeawayLimits.MAX_ACTUATOR_LIMIT),
                Map.entry(
                        "ControllerRequest/properties/periodTolerancePercent/maximum",
                        TakeawayLimits.MAX_PERIOD_TOLERANCE_PERCENT),
                Map.entry("ControllerRequest/properties/prefix/maxLength", (double) TakeawayLimits.MAX_PREFIX_LENGTH),
                Map.entry("ActuatorRange/properties/lowest/maximum", TakeawayLimits.MAX_ACTUATOR_RANGE),
                Map.entry("ActuatorRange/properties/highest/minimum", -TakeawayLimits.MAX_ACTUATOR_RANGE),
                Map.entry("OperatingPoint/properties/output/maximum", TakeawayLimits.MAX_OPERATING_OUTPUT),
                Map.entry("OperatingPoint/properties/command/minimum", -TakeawayLimits.MAX_ACTUATOR_RANGE),
                Map.entry("PlotRequest/properties/actuatorLimit/maximum", TakeawayLimits.MAX_ACTUATOR_LIMIT));
        expected.forEach((pointer, value) -> {
            assertDocumented(pointer, value);
        });
        // One operation per controller format, at its fixed path, with the format's one media type.
        Map<String, String> mediaTypes = Map.of(
                "structured-text", Takeaways.STRUCTURED_TEXT,
                "c-header", Takeaways.C_HEADER,
                "c-source", Takeaways.C_SOURCE,
                "plcopen-xml", Takeaways.PLCOPEN_XML,
                "parameters", Takeaways.JSON);
        assertEquals(mediaTypes.keySet(), Set.copyOf(Takeaways.FORMATS));
        for (String format : Takeaways.FORMATS) {
            JsonNode content = contract.document()
                    .at("/paths/~1v1~1designs~1controllers~1" + format + "/post/responses/200/content");
            assertEquals(1, content.size(), format + ": one media type");
            assertTrue(content.has(mediaTypes.get(format).split(";")[0]), format + ": " + content);
        }
        assertTrue(
                contract.document()
                        .at("/paths/~1v1~1designs~1controllers~1{format}")
                        .isMissingNode(),
                "no template operation beside the formats' own");
        JsonNode figures =
                contract.document().at("/paths/~1v1~1designs~1plots~1{figure}/post/parameters/0/schema/enum");
        assertEquals(Figure.values().length, figures.size());
        for (Figure figure : Figure.values()) {
            assertEquals(figure.slug(), figures.get(figure.ordinal()).asText());
        }
    }

    /** Record components and schema properties must be the same names, recursively. */
    /**
     * A JSON response the endpoint runner writes: the record's members and the required member {@code trace} that
     * the runner adds (schema Trace, which matches the record api.endpoint.Trace).
     */
    private void assertTracedResponseMatchesSchema(Class<?> type, JsonNode schema, String where) {
        com.fasterxml.jackson.databind.node.ObjectNode copy =
                (com.fasterxml.jackson.databind.node.ObjectNode) resolve(schema).deepCopy();
        assertEquals(
                "#/components/schemas/Trace", copy.at("/properties/trace/$ref").asText(), where + " has a trace");
        boolean required = false;
        for (JsonNode name : copy.path("required")) {
            required |= name.asText().equals("trace");
        }
        assertTrue(required, where + " requires its trace");
        ((com.fasterxml.jackson.databind.node.ObjectNode) copy.get("properties")).remove("trace");
        assertRecordMatchesSchema(type, copy, where);
        assertRecordMatchesSchema(
                com.loopwright.api.endpoint.Trace.class, contract.component("Trace"), where + ".trace");
    }

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
            } else if (componentType == PlantInput.class) {
                assertPlantFormsMatchUnion(property, path);
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

    /**
     * The plant, a tagged union decoded into a sealed type: one closed branch per form, whose properties are
     * "form" and the components of the form's record (checked like any record).
     */
    private void assertPlantFormsMatchUnion(JsonNode schema, String where) {
        JsonNode branches = schema.get("oneOf");
        assertEquals(PlantFormName.values().length, branches.size(), where + ": one branch per form");
        for (PlantFormName form : PlantFormName.values()) {
            JsonNode branch = null;
            for (JsonNode candidate : branches) {
                if (resolve(candidate).at("/properties/form/enum/0").asText().equals(form.wireName())) {
                    branch = resolve(candidate);
                }
            }
            assertTrue(branch != null, where + " has a branch for " + form.wireName());
            ObjectNode fields = branch.deepCopy();
            assertTrue(((ObjectNode) fields.get("properties")).remove("form") != null, form.wireName() + ".form");
            assertRecordMatchesSchema(form.record(), fields, where + "(" + form.wireName() + ")");
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
        if (type == int.class || type == Integer.class || type == long.class || type == Long.class) {
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
