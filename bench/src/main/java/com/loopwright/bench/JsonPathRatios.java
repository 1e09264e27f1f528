package com.loopwright.bench;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.design.DesignRequest;
import com.loopwright.api.design.DesignRequestValidator;
import com.loopwright.api.design.DesignResponseMapper;
import com.loopwright.api.design.ValidatedDesign;
import com.loopwright.api.json.FiniteNumbersModule;
import com.loopwright.api.json.StrictJson;
import com.loopwright.solver.pipeline.DesignReport;
import com.loopwright.solver.pipeline.LoopDesigner;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.function.Supplier;

/**
 * CPU time of everything a design request costs around the solver, with the solver's report computed once:
 * decoding and validating the request, mapping the report to the response record, and writing it with the
 * never-NaN guard. Two ways of writing are paired as in {@link PairedRatios}: the tree route (valueToTree through
 * FiniteNumbersModule, then the tree written; the route tree-building endpoints took before the endpoint runner)
 * and the direct route (the record written through FiniteNumbersModule, as the runner does). Run: {@code java -cp bench/target/loopwright-bench.jar com.loopwright.bench.JsonPathRatios}.
 */
public final class JsonPathRatios {

    private JsonPathRatios() {}

    public static void main(String[] args) {
        ObjectMapper mapper = StrictJson.newMapper();
        ObjectMapper writer = FiniteNumbersModule.responseWriter(mapper);
        DesignRequestValidator validator = new DesignRequestValidator();
        DesignResponseMapper responses = new DesignResponseMapper();
        byte[] body = Scenarios.indexingAxisRequestBytes();
        ValidatedDesign design = validator.validate(read(mapper, body));
        DesignReport report = new LoopDesigner()
                .design(design.plant(), design.spec(), design.gammaChoice(), design.stepSize(), design.bandFraction());

        Supplier<Object> decode = () -> validator.validate(read(mapper, body));
        Supplier<Object> map = () -> responses.toResponse(design, report, null, null);
        Supplier<Object> treeRoute = () -> {
            JsonNode tree = writer.valueToTree(responses.toResponse(design, report, null, null));
            return write(mapper, tree);
        };
        Supplier<Object> directRoute = () -> write(writer, responses.toResponse(design, report, null, null));

        System.out.printf("load before: %.2f%n", load());
        for (var single : new Object[][] {
            {"decode + validate the request", decode}, {"map the report to the response record", map}
        }) {
            @SuppressWarnings("unchecked")
            double nanos = PairedRatios.single((Supplier<Object>) single[1]);
            System.out.printf("%-60s %8.2f us CPU%n", single[0], nanos / 1e3);
        }
        PairedRatios.Ratio ratio = PairedRatios.measure(new PairedRatios.Pair(
                "map + write: direct with finite serializer vs guarded tree", directRoute, treeRoute));
        System.out.printf(
                "%-60s direct %8.2f us  tree %8.2f us  speedup %5.2fx%n",
                ratio.name(), ratio.oursNanos() / 1e3, ratio.referenceNanos() / 1e3, ratio.speedup());
        System.out.printf(
                "response size: %d bytes%n", write(writer, responses.toResponse(design, report, null, null)).length);
        System.out.printf("load after: %.2f%n", load());
    }

    private static DesignRequest read(ObjectMapper mapper, byte[] body) {
        try {
            return mapper.readValue(body, DesignRequest.class);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static byte[] write(ObjectMapper mapper, Object value) {
        try {
            return mapper.writeValueAsBytes(value);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    private static double load() {
        return java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
    }
}
