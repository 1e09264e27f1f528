package com.loopwright.api.endpoint;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HexFormat;
import java.util.List;
import java.util.function.IntFunction;

/**
 * SHA-256 (FIPS 180-4) of the canonical JSON form of a decoded request, written {@code sha256:} and 64 lower-case
 * hex digits. Canonical form: the value as the mapper writes it, as a tree, then written with object members sorted
 * by name (String order), members whose value is null left out, every number written as Jackson writes a double
 * ({@code 2} and {@code 2.0} both as {@code 2.0}), UTF-8, no whitespace. So the same request sent with another key
 * order, other spacing or another spelling of a number has the same digest. Stateless and thread-safe.
 */
public final class RequestDigest {

    /** The digest's prefix: the algorithm. */
    public static final String PREFIX = "sha256:";

    private final ObjectMapper mapper;

    /** @param mapper writes decoded request records as trees (the strict mapper) */
    public RequestDigest(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    /**
     * The digest of a decoded request record (or tree); null when the decoded value has no JSON form (a plant
     * that makes no one form, kept only so that validation can name its fields): such a request did not decode
     * into a request of the contract.
     */
    public String of(Object request) {
        JsonNode tree;
        try {
            tree = request instanceof JsonNode node ? node : mapper.valueToTree(request);
        } catch (IllegalArgumentException notWritable) {
            return null;
        }
        JsonNode value = tree == null ? com.fasterxml.jackson.databind.node.NullNode.getInstance() : tree;
        return digest(out -> write(out, value));
    }

    /**
     * The digest of the envelope {"items": [item 0, ..., item count-1]}, reading one item at a time, so that no
     * tree of the whole envelope is built.
     */
    public String ofItems(int count, IntFunction<JsonNode> item) {
        Envelope envelope = envelope();
        for (int index = 0; index < count; index++) { // count is capped by the batch cap
            envelope.add(item.apply(index));
        }
        return envelope.digest();
    }

    /**
     * The digest of an envelope {"items": [...]} fed one item at a time ({@link Envelope#add}), so that a caller
     * reading the items for another purpose too (a batch's cost estimate) builds each item's tree once.
     */
    public Envelope envelope() {
        return new Envelope();
    }

    /** An envelope digest in progress: items in request order, then {@link #digest()} once. Not thread-safe. */
    public final class Envelope {
        private final MessageDigest sha256 = sha256();
        private final JsonGenerator generator;

        private Envelope() {
            try {
                generator = mapper.getFactory()
                        .createGenerator(new DigestOutputStream(OutputStream.nullOutputStream(), sha256));
                generator.writeStartObject();
                generator.writeFieldName("items");
                generator.writeStartArray();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }

        /** Adds the next item (in its canonical form) and returns it, so a reading loop can pass it on. */
        public JsonNode add(JsonNode item) {
            try {
                canonical(generator, item);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            return item;
        }

        /** Closes the envelope and gives its digest. */
        public String digest() {
            try {
                generator.writeEndArray();
                generator.writeEndObject();
                generator.close();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            return PREFIX + HexFormat.of().formatHex(sha256.digest());
        }
    }

    /** The canonical bytes of a tree (for tests and for documentation). */
    public byte[] canonicalBytes(JsonNode tree) {
        java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
        try {
            write(out, tree);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toByteArray();
    }

    private void write(OutputStream out, JsonNode tree) throws IOException {
        try (JsonGenerator generator = mapper.getFactory().createGenerator(out)) {
            canonical(generator, tree);
        }
    }

    /** Writes the canonical form; the recursion is as deep as the decoded value (bounded by the parser's cap). */
    private static void canonical(JsonGenerator generator, JsonNode node) throws IOException {
        if (node.isObject()) {
            List<String> names = new ArrayList<>(node.size());
            node.fieldNames().forEachRemaining(names::add);
            Collections.sort(names);
            generator.writeStartObject();
            for (String name : names) {
                JsonNode value = node.get(name);
                if (!value.isNull()) {
                    generator.writeFieldName(name);
                    canonical(generator, value);
                }
            }
            generator.writeEndObject();
        } else if (node.isArray()) {
            generator.writeStartArray();
            for (JsonNode element : node) {
                canonical(generator, element);
            }
            generator.writeEndArray();
        } else if (node.isNumber()) {
            generator.writeNumber(node.doubleValue());
        } else if (node.isTextual()) {
            generator.writeString(node.textValue());
        } else if (node.isBoolean()) {
            generator.writeBoolean(node.booleanValue());
        } else {
            generator.writeNull();
        }
    }

    private interface Writing {
        void to(OutputStream out) throws IOException;
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform provides SHA-256", e);
        }
    }

    private static String digest(Writing writing) {
        MessageDigest sha256 = sha256();
        try (DigestOutputStream out = new DigestOutputStream(OutputStream.nullOutputStream(), sha256)) {
            writing.to(out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return PREFIX + HexFormat.of().formatHex(sha256.digest());
    }
}
