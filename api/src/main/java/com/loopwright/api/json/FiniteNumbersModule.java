package com.loopwright.api.json;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.core.StreamWriteFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.module.SimpleModule;
import com.fasterxml.jackson.databind.ser.std.StdSerializer;
import java.io.IOException;
import java.util.ArrayDeque;
import java.util.Deque;

/**
 * Serializers for double, Double, float, Float and double[] that refuse NaN and the infinities while the value
 * is written, with the JSON pointer of the offending value ({@link NonFiniteNumberException}). This is the
 * never-NaN guard of response records serialized directly, without building a JSON tree first and walking it.
 */
public final class FiniteNumbersModule extends SimpleModule {

    private static final long serialVersionUID = 1L;

    public FiniteNumbersModule() {
        super("loopwright-finite-numbers");
        DoubleSerializer doubles = new DoubleSerializer();
        FloatSerializer floats = new FloatSerializer();
        addSerializer(Double.class, doubles);
        addSerializer(Double.TYPE, doubles);
        addSerializer(Float.class, floats);
        addSerializer(Float.TYPE, floats);
        addSerializer(double[].class, new DoubleArraySerializer());
    }

    /**
     * A mapper for writing responses: the given mapper's configuration plus this module, and the shortest
     * round-trip double formatting (StreamWriteFeature.USE_FAST_DOUBLE_WRITER: the fewest digits that parse back
     * to the same double, so the value is exact; tested bit for bit in FiniteNumbersModuleTest).
     */
    public static ObjectMapper responseWriter(ObjectMapper strict) {
        ObjectMapper copy = strict.copy();
        copy.getFactory().enable(StreamWriteFeature.USE_FAST_DOUBLE_WRITER.mappedFeature());
        copy.registerModule(new FiniteNumbersModule());
        return copy;
    }

    /** Convenience for tests and tools: a fresh strict mapper with the module. */
    public static ObjectMapper newResponseWriter() {
        return responseWriter(StrictJson.newMapper());
    }

    /** JSON pointer of the value about to be written in {@code context} (the next array entry, or the named field). */
    static String pointerOfNextValue(JsonStreamContext context) {
        Deque<String> parts = new ArrayDeque<>();
        boolean innermost = true;
        for (JsonStreamContext c = context; c != null && !c.inRoot(); c = c.getParent()) {
            if (c.inArray()) {
                // entries written so far: the pending entry's index in the innermost array, the current one's + 1 above
                parts.push("/" + (innermost ? c.getEntryCount() : c.getEntryCount() - 1));
            } else if (c.getCurrentName() != null) {
                parts.push("/" + c.getCurrentName().replace("~", "~0").replace("/", "~1"));
            }
            innermost = false;
        }
        return String.join("", parts);
    }

    private static NonFiniteNumberException refuse(JsonGenerator generator) {
        return new NonFiniteNumberException(generator, pointerOfNextValue(generator.getOutputContext()));
    }

    private static final class DoubleSerializer extends StdSerializer<Double> {
        private static final long serialVersionUID = 1L;

        DoubleSerializer() {
            super(Double.class);
        }

        @Override
        public void serialize(Double value, JsonGenerator generator, SerializerProvider provider) throws IOException {
            double v = value;
            if (!Double.isFinite(v)) {
                throw refuse(generator);
            }
            generator.writeNumber(v);
        }
    }

    private static final class FloatSerializer extends StdSerializer<Float> {
        private static final long serialVersionUID = 1L;

        FloatSerializer() {
            super(Float.class);
        }

        @Override
        public void serialize(Float value, JsonGenerator generator, SerializerProvider provider) throws IOException {
            float v = value;
            if (!Float.isFinite(v)) {
                throw refuse(generator);
            }
            generator.writeNumber(v);
        }
    }

    private static final class DoubleArraySerializer extends StdSerializer<double[]> {
        private static final long serialVersionUID = 1L;

        DoubleArraySerializer() {
            super(double[].class);
        }

        @Override
        public void serialize(double[] values, JsonGenerator generator, SerializerProvider provider)
                throws IOException {
            generator.writeStartArray(values, values.length);
            for (double v : values) {
                if (!Double.isFinite(v)) {
                    throw refuse(generator);
                }
                generator.writeNumber(v);
            }
            generator.writeEndArray();
        }
    }
}
