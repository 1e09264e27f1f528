package com.loopwright.api.json;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.MapperFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.json.JsonMapper;

/**
 * The one JSON configuration of the wire format: unknown fields, duplicate keys, trailing content, strings for
 * numbers, NaN/Infinity tokens, fractions for integer fields (2.9 is not truncated to 2) and deep nesting are all
 * rejected.
 */
public final class StrictJson {

    /** No request of this API nests deeper than 4; 16 leaves room without inviting stack games. */
    public static final int MAX_NESTING_DEPTH = 16;

    public static final int MAX_STRING_LENGTH = 10_000;
    public static final int MAX_NUMBER_LENGTH = 100;

    private StrictJson() {}

    public static ObjectMapper newMapper() {
        JsonFactory factory = JsonFactory.builder()
                .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
                // Correctly rounded like Double.parseDouble, only faster (round trip: FiniteNumbersModuleTest).
                .enable(StreamReadFeature.USE_FAST_DOUBLE_PARSER)
                .streamReadConstraints(StreamReadConstraints.builder()
                        .maxNestingDepth(MAX_NESTING_DEPTH)
                        .maxStringLength(MAX_STRING_LENGTH)
                        .maxNumberLength(MAX_NUMBER_LENGTH)
                        .build())
                .build();
        return JsonMapper.builder(factory)
                .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
                .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
                .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES)
                .enable(DeserializationFeature.FAIL_ON_READING_DUP_TREE_KEY)
                .disable(MapperFeature.ALLOW_COERCION_OF_SCALARS)
                // An integer field (monteCarloSamples, seed, timeSeriesPoints...) takes only an integer token.
                .disable(DeserializationFeature.ACCEPT_FLOAT_AS_INT)
                .disable(SerializationFeature.FAIL_ON_EMPTY_BEANS)
                .build();
    }
}
