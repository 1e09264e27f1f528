package com.loopwright.service;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.networknt.schema.JsonSchema;
import com.networknt.schema.JsonSchemaFactory;
import com.networknt.schema.SpecVersion;
import com.networknt.schema.ValidationMessage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;
import java.util.stream.Collectors;

/** The repository's openapi.yaml as a JSON tree, with JSON Schema 2020-12 validation of bodies against it. */
final class Contract {

    static final Path FILE = Path.of("..", "openapi.yaml");

    private final JsonNode document;
    private final java.util.Map<String, JsonSchema> compiled = new java.util.concurrent.ConcurrentHashMap<>();
    private final JsonSchemaFactory schemas = JsonSchemaFactory.getInstance(SpecVersion.VersionFlag.V202012);

    private Contract(JsonNode document) {
        this.document = document;
    }

    static Contract load() {
        try {
            return new Contract(new ObjectMapper(new YAMLFactory()).readTree(Files.readString(FILE)));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    JsonNode document() {
        return document;
    }

    /** Schema node of a named component, e.g. "DesignResponse". */
    JsonNode component(String name) {
        JsonNode node = document.at("/components/schemas/" + name);
        if (node.isMissingNode()) {
            throw new AssertionError("openapi.yaml has no component schema " + name);
        }
        return node;
    }

    /**
     * A node under components/schemas by a slash-separated path such as
     * "FitRequest/properties/samples/properties/time/maxItems", following every $ref on the way, so the path names
     * the place in the request or response and not the component that happens to hold it.
     */
    JsonNode schemaAt(String path) {
        JsonNode node = document.at("/components/schemas");
        for (String segment : path.split("/")) {
            node = resolve(node).path(segment);
        }
        return node;
    }

    /** The component a {"$ref": "#/components/schemas/X"} schema names, or the schema itself. */
    JsonNode resolve(JsonNode schema) {
        JsonNode ref = schema.get("$ref");
        return ref == null ? schema : document.at(ref.asText().substring(1));
    }

    /**
     * The schema declared for a response: paths[path][method].responses[status].content[mediaType].schema,
     * compiled with the whole document as its root so that internal $refs resolve.
     */
    JsonSchema responseSchema(String path, String method, int status, String mediaType) {
        String response = "/paths/" + path.replace("~", "~0").replace("/", "~1") + "/" + method.toLowerCase()
                + "/responses/" + status;
        JsonNode reference = document.at(response + "/$ref");
        if (reference.isTextual()) {
            // A shared response under components/responses.
            response = reference.asText().substring(1);
        }
        String pointer = response + "/content/" + mediaType.replace("/", "~1") + "/schema";
        if (document.at(pointer).isMissingNode()) {
            throw new AssertionError(
                    "openapi.yaml declares no " + mediaType + " body for " + method + " " + path + " " + status);
        }
        return compiled.computeIfAbsent(pointer, p -> {
            ObjectNode root = document.deepCopy();
            root.put("$ref", "#" + p);
            return schemas.getSchema(root);
        });
    }

    /** A named component schema compiled with the whole document as its root, so that internal $refs resolve. */
    JsonSchema componentSchema(String name) {
        component(name);
        return compiled.computeIfAbsent("/components/schemas/" + name, p -> {
            ObjectNode root = document.deepCopy();
            root.put("$ref", "#" + p);
            return schemas.getSchema(root);
        });
    }

    /** Validation messages of a body against the declared response schema; empty when it conforms. */
    String violations(String path, String method, int status, String mediaType, JsonNode body) {
        Set<ValidationMessage> messages =
                responseSchema(path, method, status, mediaType).validate(body);
        return messages.stream().map(ValidationMessage::getMessage).collect(Collectors.joining("; "));
    }
}
