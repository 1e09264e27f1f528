package com.loopwright.api.plant;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.loopwright.api.json.StrictJson;
import com.loopwright.api.problem.FieldError;
import java.lang.reflect.RecordComponent;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/** The field list of each form is its record's components: declared once, read everywhere from there. */
class PlantFormNameTest {

    private static final ObjectMapper STRICT = StrictJson.newMapper();

    /** A rotary axis with one more field than the wire form has, as a new field would be declared. */
    record RotaryAxisWithBrake(
            Double inertia, Double viscousFriction, Double torqueConstant, Double gearRatio, Double brakeTorque) {}

    @Test
    void fieldsAreTheRecordComponentsInDeclaredOrder() {
        for (PlantFormName form : PlantFormName.values()) {
            List<String> components = new ArrayList<>();
            for (RecordComponent component : form.record().getRecordComponents()) {
                components.add(component.getName());
            }
            assertEquals(components, List.copyOf(form.fields()), form.wireName());
        }
        // the lists as the contract documents them (openapi.yaml, one branch per form)
        assertEquals(List.of("a0", "a1", "b", "d"), List.copyOf(PlantFormName.CANONICAL.fields()));
        assertEquals(
                List.of("inertia", "viscousFriction", "torqueConstant", "gearRatio"),
                List.copyOf(PlantFormName.ROTARY_AXIS.fields()));
        assertEquals(List.of("a", "b2", "b1"), List.copyOf(PlantFormName.STATE_SPACE.fields()));
    }

    @Test
    void aComponentAddedToARecordIsAFieldOfItsForm() {
        Set<String> withBrake = PlantFormName.componentNames(RotaryAxisWithBrake.class);
        assertTrue(withBrake.contains("brakeTorque"));
        assertEquals(PlantFormName.ROTARY_AXIS.fields().size() + 1, withBrake.size());
        assertTrue(withBrake.containsAll(PlantFormName.ROTARY_AXIS.fields()));
    }

    @Test
    void everyFormRecordIsPermittedAndRegisteredOnce() {
        Set<Class<?>> registered = new HashSet<>();
        for (PlantFormName form : PlantFormName.values()) {
            assertTrue(registered.add(form.record()), form.wireName());
        }
        Set<Class<?>> permitted = new HashSet<>(List.of(PlantInput.class.getPermittedSubclasses()));
        assertTrue(permitted.remove(UnmatchedPlant.class));
        assertEquals(permitted, registered, "PlantInput permits exactly the registered forms and UnmatchedPlant");
        // decoding dispatches on the field name alone: no name twice, none called "form"
        int declared = 0;
        for (PlantFormName form : PlantFormName.values()) {
            declared += form.fields().size();
            assertTrue(!form.fields().contains(PlantFormName.FORM_FIELD), form.wireName());
        }
        assertEquals(declared + 1, PlantFormName.wireFields().size());
    }

    // Every component of every form record is accepted under its own form and refused under each other form,
    // with the message naming the other form's fields, sorted: the accepted set follows the record.
    @Test
    void eachComponentIsAcceptedByItsFormOnly() throws Exception {
        for (PlantFormName form : PlantFormName.values()) {
            for (RecordComponent component : form.record().getRecordComponents()) {
                String field = "\"" + component.getName() + "\":" + sampleValue(component);
                PlantInput own =
                        STRICT.readValue("{\"form\":\"" + form.wireName() + "\"," + field + "}", PlantInput.class);
                assertInstanceOf(form.record(), own, component.getName());
                assertNotEquals(null, component.getAccessor().invoke(own), component.getName());
                for (PlantFormName other : PlantFormName.values()) {
                    if (other == form) {
                        continue;
                    }
                    PlantInput mixed =
                            STRICT.readValue("{\"form\":\"" + other.wireName() + "\"," + field + "}", PlantInput.class);
                    List<FieldError> errors = new ArrayList<>();
                    assertEquals(null, mixed.resolve(errors));
                    assertEquals(
                            List.of(new FieldError(
                                    "/plant/" + component.getName(),
                                    "not a field of the " + other.wireName() + " form (its fields: "
                                            + new TreeSet<>(other.fields()) + ")")),
                            errors);
                }
            }
        }
    }

    private static String sampleValue(RecordComponent component) {
        if (component.getType() != List.class) {
            return "1.5";
        }
        return component.getGenericType().getTypeName().contains("List<java.util.List") ? "[[1,2],[3,4]]" : "[1,2]";
    }
}
