package com.loopwright.api.plant;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.BeanProperty;
import com.fasterxml.jackson.databind.DeserializationContext;
import com.fasterxml.jackson.databind.JsonDeserializer;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.deser.ContextualDeserializer;
import com.fasterxml.jackson.databind.deser.std.StdDeserializer;
import com.fasterxml.jackson.databind.util.TokenBuffer;
import java.io.IOException;
import java.lang.reflect.Type;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Decodes a plant object into the record of its form, field by field in document order, with the strict rules of
 * every other request object: each field is read as its record component's type (a wrong type names the field's
 * pointer), unknown fields are refused after the object has been read (the first one is named), a field that
 * cannot be tokenized fails the whole plant. The form is chosen once every field has been read: an absent (or
 * null) form, an unknown form name or fields of other forms make an {@link UnmatchedPlant} for validation.
 */
final class PlantInputDeserializer extends StdDeserializer<PlantInput> implements ContextualDeserializer {

    /** Every wire field of a plant object with its Java type; names are unique across forms. */
    private static final Map<String, Type> WIRE_FIELDS = PlantFormName.wireFields();

    /** The value deserializer of each wire field, found once per mapper (empty before contextualization). */
    private final Map<String, JsonDeserializer<Object>> fieldDeserializers;

    PlantInputDeserializer() {
        this(Map.of());
    }

    private PlantInputDeserializer(Map<String, JsonDeserializer<Object>> fieldDeserializers) {
        super(PlantInput.class);
        this.fieldDeserializers = fieldDeserializers;
    }

    @Override
    public JsonDeserializer<?> createContextual(DeserializationContext ctxt, BeanProperty property)
            throws JsonMappingException {
        Map<String, JsonDeserializer<Object>> found = new HashMap<>();
        for (Map.Entry<String, Type> field : WIRE_FIELDS.entrySet()) {
            found.put(field.getKey(), ctxt.findContextualValueDeserializer(ctxt.constructType(field.getValue()), null));
        }
        return new PlantInputDeserializer(Map.copyOf(found));
    }

    @Override
    public PlantInput deserialize(JsonParser p, DeserializationContext ctxt) throws IOException {
        JsonToken token = p.currentToken();
        if (token == JsonToken.START_OBJECT) {
            token = p.nextToken();
        } else if (token != JsonToken.FIELD_NAME && token != JsonToken.END_OBJECT) {
            return (PlantInput) ctxt.handleUnexpectedToken(PlantInput.class, p);
        }
        Map<String, Object> values = new HashMap<>();
        String firstUnknown = null;
        TokenBuffer unknownValues = null;
        // Once every wire field has a value the object is complete and a later unknown field is refused at once
        // (before, unknown fields wait for the end of the object): the order in which the flat record of all forms'
        // fields reported failures, which the recorded answers keep.
        boolean complete = false;
        while (token == JsonToken.FIELD_NAME) {
            String name = p.currentName();
            p.nextToken(); // to the value
            JsonDeserializer<Object> field = fieldDeserializers.get(name);
            if (field == null) {
                if (complete) {
                    refuseUnknown(p, ctxt, name);
                } else {
                    firstUnknown = firstUnknown == null ? name : firstUnknown;
                    // Read through the value as any unknown value is read: its tokens must still be valid JSON.
                    unknownValues = unknownValues == null ? ctxt.bufferForInputBuffering(p) : unknownValues;
                    unknownValues.writeFieldName(name);
                    unknownValues.copyCurrentStructure(p);
                }
            } else {
                values.put(name, read(p, ctxt, name, field));
                if (!complete && values.size() == WIRE_FIELDS.size()) {
                    complete = true;
                    token = p.nextToken();
                    if (firstUnknown != null) {
                        refuseUnknown(p, ctxt, firstUnknown);
                    }
                    continue;
                }
            }
            token = p.nextToken();
        }
        if (firstUnknown != null && !complete) {
            refuseUnknown(p, ctxt, firstUnknown);
        }
        return choose(values);
    }

    /** The record of the chosen form, or an {@link UnmatchedPlant} when the fields make no one form. */
    private static PlantInput choose(Map<String, Object> values) {
        String formName = (String) values.get(PlantFormName.FORM_FIELD);
        Optional<PlantFormName> named = formName == null ? Optional.empty() : PlantFormName.ofWireName(formName);
        if (named.isEmpty()) {
            return new UnmatchedPlant(formName, List.of());
        }
        List<String> foreign = new ArrayList<>();
        for (PlantFormName other : PlantFormName.values()) {
            if (other == named.get()) {
                continue;
            }
            for (String field : other.fields()) {
                if (values.get(field) != null) {
                    foreign.add(field);
                }
            }
        }
        return foreign.isEmpty() ? named.get().instantiate(values) : new UnmatchedPlant(formName, foreign);
    }

    /** One field's value as its declared type; a failure inside it names the field's pointer. */
    private static Object read(
            JsonParser p, DeserializationContext ctxt, String name, JsonDeserializer<Object> deserializer)
            throws IOException {
        try {
            if (p.hasToken(JsonToken.VALUE_NULL)) {
                return null;
            }
            return deserializer.deserialize(p, ctxt);
        } catch (Exception e) {
            if (e instanceof IOException io && !(e instanceof JacksonException)) {
                throw io;
            }
            throw JsonMappingException.wrapWithPath(e, PlantInput.class, name);
        }
    }

    /** Refuses an unknown field (under the strict mapper); a lenient mapper skips its value. */
    private void refuseUnknown(JsonParser p, DeserializationContext ctxt, String name) throws IOException {
        if (!ctxt.handleUnknownProperty(p, this, PlantInput.class, name)) {
            p.skipChildren();
        }
    }

    @Override
    public Collection<Object> getKnownPropertyNames() {
        return new ArrayList<>(WIRE_FIELDS.keySet());
    }
}
