package com.loopwright.service.routes;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import com.loopwright.service.compute.BatchItem;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.List;

/**
 * The envelope {"items": [...]} of a batch, read as a stream of tokens so that its memory stays a small multiple of
 * the body: the items are located (byte ranges of the body) and counted while reading, the cap is checked on the
 * count, and no tree of the whole body is built. An item becomes a tree only when it is read ({@link #item}): the
 * batch route reads each once, one at a time, for its cost estimate and digest, and a design decodes its item
 * straight from the bytes ({@link #object}). The whole body is still checked
 * for JSON syntax, duplicate keys, trailing content and every StreamReadConstraints cap (strings too: they are
 * decoded while skipped) by the same strict parser, so a malformed body is refused before any item is designed.
 */
final class BatchEnvelope {

    private final ObjectMapper mapper;
    private final byte[] body;
    /** Per item: its first byte and the byte after its last, or -1 for an item that is not an object. */
    private final int[] starts;

    private final int[] ends;
    private final JsonNode[] others;
    private final int size;

    private BatchEnvelope(ObjectMapper mapper, byte[] body, int[] starts, int[] ends, JsonNode[] others, int size) {
        this.mapper = mapper;
        this.body = body;
        this.starts = starts;
        this.ends = ends;
        this.others = others;
        this.size = size;
    }

    int size() {
        return size;
    }

    /**
     * Item {@code index} as a tree. An item that is not an object is not a DesignRequest whatever it holds; it is
     * given as an empty value of its kind (an array, or the scalar itself), which the design exchange refuses with
     * the same problem, so that a large non-object item never becomes a large tree.
     */
    JsonNode item(int index) {
        if (starts[index] < 0) {
            return others[index];
        }
        try {
            return mapper.readTree(body, starts[index], ends[index] - starts[index]);
        } catch (IOException e) {
            // The range was read once already by the same parser; it cannot fail now.
            throw new UncheckedIOException("a batch item could not be read again", e);
        }
    }

    /**
     * Item {@code index} as its bytes, to be decoded without a tree, or null for an item that is not an object
     * (given by {@link #item} instead).
     */
    BatchItem object(int index) {
        return starts[index] < 0 ? null : new BatchItem(mapper, body, starts[index], ends[index] - starts[index]);
    }

    /**
     * Reads the envelope.
     *
     * @throws Invalid                  for a well-formed body that is not a valid envelope
     * @throws IOException              for malformed JSON (a JsonProcessingException) or unreadable bytes
     */
    static BatchEnvelope read(ObjectMapper mapper, byte[] body, int maxItems) throws IOException, Invalid {
        int[] starts = new int[maxItems];
        int[] ends = new int[maxItems];
        JsonNode[] others = new JsonNode[maxItems];
        Invalid first = null;
        int count = -1;
        try (JsonParser parser = mapper.createParser(body)) {
            JsonToken token = parser.nextToken();
            if (token == null) {
                throw new Invalid("", "the body must be one JSON object {\"items\": [...]}");
            }
            if (token != JsonToken.START_OBJECT) {
                first = new Invalid("", "the body must be one JSON object {\"items\": [...]}");
                skip(parser);
            } else {
                while (parser.nextToken() == JsonToken.FIELD_NAME) {
                    String name = parser.currentName();
                    token = parser.nextToken();
                    if (!name.equals("items")) {
                        if (first == null) {
                            first = new Invalid(
                                    "/" + name.replace("~", "~0").replace("/", "~1"),
                                    "unknown field '" + (name.length() > 64 ? name.substring(0, 64) + "..." : name)
                                            + "'");
                        }
                        skip(parser);
                    } else if (token != JsonToken.START_ARRAY) {
                        if (first == null) {
                            first = new Invalid("/items", "wrong type: expected a JSON array");
                        }
                        skip(parser);
                    } else {
                        // Bounded by the body: every item is at least one byte.
                        count = 0;
                        while ((token = parser.nextToken()) != JsonToken.END_ARRAY) {
                            if (count < maxItems) {
                                locate(parser, token, count, starts, ends, others);
                            } else {
                                skip(parser);
                            }
                            count++;
                        }
                    }
                }
            }
            if (parser.nextToken() != null) {
                // The same failure the strict mapper gives for trailing content (FAIL_ON_TRAILING_TOKENS).
                throw MismatchedInputException.from(parser, JsonNode.class, "Trailing token after the batch envelope");
            }
        }
        if (first != null) {
            throw first;
        }
        if (count < 0) {
            throw new Invalid("/items", "required: an array of design requests");
        }
        if (count == 0 || count > maxItems) {
            throw new Invalid("/items", "must hold from 1 to " + maxItems + " design requests, not " + count);
        }
        return new BatchEnvelope(mapper, body, starts, ends, others, count);
    }

    private static void locate(
            JsonParser parser, JsonToken token, int index, int[] starts, int[] ends, JsonNode[] others)
            throws IOException {
        if (token == JsonToken.START_OBJECT) {
            starts[index] = Math.toIntExact(parser.currentTokenLocation().getByteOffset());
            skip(parser);
            ends[index] = Math.toIntExact(parser.currentLocation().getByteOffset());
        } else if (token == JsonToken.START_ARRAY) {
            starts[index] = -1;
            others[index] = JsonNodeFactory.instance.arrayNode();
            skip(parser);
        } else {
            starts[index] = -1;
            others[index] = scalar(parser, token);
        }
    }

    /**
     * Skips the value at the parser like {@link JsonParser#skipChildren}, but decodes every string (into the
     * parser's reused buffer) so that the string length cap applies as in a full parse; nesting depth and number
     * length are checked by the parser on every token anyway. Bounded by the body: each token consumes a byte.
     */
    private static void skip(JsonParser parser) throws IOException {
        JsonToken token = parser.currentToken();
        if (token == JsonToken.VALUE_STRING) {
            checkString(parser);
            return;
        }
        if (token != JsonToken.START_OBJECT && token != JsonToken.START_ARRAY) {
            return;
        }
        int depth = 1;
        while (depth > 0) {
            token = parser.nextToken();
            if (token == null) {
                return; // the parser reports an unclosed value itself
            }
            if (token.isStructStart()) {
                depth++;
            } else if (token.isStructEnd()) {
                depth--;
            } else if (token == JsonToken.VALUE_STRING) {
                checkString(parser);
            }
        }
    }

    /** The string length cap of a full parse (which checks it when it builds the text), without building it. */
    private static void checkString(JsonParser parser) throws IOException {
        parser.streamReadConstraints().validateStringLength(parser.getTextLength());
    }

    /** The scalar at the parser as a node (a string is at most the parser's string length cap). */
    private static JsonNode scalar(JsonParser parser, JsonToken token) throws IOException {
        JsonNodeFactory nodes = JsonNodeFactory.instance;
        return switch (token) {
            case VALUE_STRING -> nodes.textNode(parser.getText());
            case VALUE_NUMBER_INT ->
                switch (parser.getNumberType()) {
                    case INT -> nodes.numberNode(parser.getIntValue());
                    case LONG -> nodes.numberNode(parser.getLongValue());
                    default -> nodes.numberNode(parser.getBigIntegerValue());
                };
            case VALUE_NUMBER_FLOAT -> nodes.numberNode(parser.getDoubleValue());
            case VALUE_TRUE -> nodes.booleanNode(true);
            case VALUE_FALSE -> nodes.booleanNode(false);
            default -> nodes.nullNode();
        };
    }

    /** A well-formed body that is not a valid envelope: a 400 invalid-field problem naming the member. */
    static final class Invalid extends Exception {
        private final transient Problem problem;

        Invalid(String pointer, String detail) {
            super(detail, null, false, false);
            this.problem = ProblemType.INVALID_FIELD.problem(
                    pointer.isEmpty() ? detail : "field " + pointer + ": " + detail,
                    List.of(new FieldError(pointer, detail)),
                    List.of());
        }

        Problem problem() {
            return problem;
        }
    }
}
