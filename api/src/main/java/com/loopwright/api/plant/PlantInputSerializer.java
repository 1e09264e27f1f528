package com.loopwright.api.plant;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.ser.std.StdSerializer;
import java.io.IOException;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.RecordComponent;

/**
 * Writes a plant form as the caller sends it: {@code form}, then the record's non-null components. An {@link UnmatchedPlant} is not a form and cannot be written.
 */
final class PlantInputSerializer extends StdSerializer<PlantInput> {

    PlantInputSerializer() {
        super(PlantInput.class);
    }

    @Override
    public void serialize(PlantInput plant, JsonGenerator gen, SerializerProvider provider) throws IOException {
        PlantFormName form = PlantFormName.of(plant).orElse(null);
        if (form == null) {
            provider.reportMappingProblem("a plant that makes no one form (%s) cannot be written", plant);
            return;
        }
        gen.writeStartObject(plant);
        gen.writeStringField(PlantFormName.FORM_FIELD, form.wireName());
        for (RecordComponent component : form.record().getRecordComponents()) {
            Object value;
            try {
                value = component.getAccessor().invoke(plant);
            } catch (IllegalAccessException | InvocationTargetException e) {
                throw new IllegalStateException("plant field " + component.getName() + " cannot be read", e);
            }
            if (value != null) {
                gen.writeFieldName(component.getName());
                provider.defaultSerializeValue(value, gen);
            }
        }
        gen.writeEndObject();
    }
}
