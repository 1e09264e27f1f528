package com.loopwright.api.plant;

import java.lang.reflect.Constructor;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The registry of plant descriptions: each wire name with the record that declares its fields. The fields a form
 * takes are that record's components, in their declared order; no field list is written out anywhere else.
 */
public enum PlantFormName {
    CANONICAL("canonical", CanonicalPlantInput.class),
    ROTARY_AXIS("rotaryAxis", RotaryAxisInput.class),
    MASS_SPRING_DAMPER("massSpringDamper", MassSpringDamperInput.class),
    SECOND_ORDER_TRANSFER_FUNCTION("secondOrderTransferFunction", SecondOrderTransferFunctionInput.class),
    STATE_SPACE("stateSpace", StateSpaceInput.class);

    /** The wire field that selects the form; no form record may declare a component of this name. */
    public static final String FORM_FIELD = "form";

    private final String wireName;
    private final Class<? extends PlantInput> record;
    private final Set<String> fields;

    PlantFormName(String wireName, Class<? extends PlantInput> record) {
        this.wireName = wireName;
        this.record = record;
        this.fields = componentNames(record);
    }

    public String wireName() {
        return wireName;
    }

    /** The record that declares this form's fields. */
    public Class<? extends PlantInput> record() {
        return record;
    }

    /** Fields this form takes (besides "form"): its record's component names, in declared order. */
    public Set<String> fields() {
        return fields;
    }

    /** The component names of a record, in declared order. */
    static Set<String> componentNames(Class<?> record) {
        Set<String> names = new LinkedHashSet<>();
        for (RecordComponent component : record.getRecordComponents()) {
            names.add(component.getName());
        }
        return Collections.unmodifiableSet(names);
    }

    public static Optional<PlantFormName> ofWireName(String name) {
        return Arrays.stream(values()).filter(f -> f.wireName.equals(name)).findFirst();
    }

    /** The form a decoded description is (empty for an {@link UnmatchedPlant}). */
    public static Optional<PlantFormName> of(PlantInput plant) {
        return Arrays.stream(values()).filter(f -> f.record == plant.getClass()).findFirst();
    }

    public static List<String> wireNames() {
        return Arrays.stream(values()).map(PlantFormName::wireName).toList();
    }

    /**
     * Every wire field of a plant object ("form" first, then each form's fields in registry and declared order)
     * with its Java type.
     *
     * @throws IllegalStateException when two forms declare the same field (decoding dispatches on the name alone)
     */
    static Map<String, Type> wireFields() {
        Map<String, Type> fields = new LinkedHashMap<>();
        fields.put(FORM_FIELD, String.class);
        for (PlantFormName form : values()) {
            for (RecordComponent component : form.record.getRecordComponents()) {
                if (fields.put(component.getName(), component.getGenericType()) != null) {
                    throw new IllegalStateException("plant field '" + component.getName() + "' of the " + form.wireName
                            + " form is declared twice");
                }
            }
        }
        return fields;
    }

    /** This form's record built from decoded field values by name (absent names are null). */
    PlantInput instantiate(Map<String, Object> values) {
        RecordComponent[] components = record.getRecordComponents();
        Object[] arguments = new Object[components.length];
        Class<?>[] types = new Class<?>[components.length];
        for (int i = 0; i < components.length; i++) {
            arguments[i] = values.get(components[i].getName());
            types[i] = components[i].getType();
        }
        try {
            Constructor<? extends PlantInput> canonical = record.getDeclaredConstructor(types);
            return canonical.newInstance(arguments);
        } catch (NoSuchMethodException | InstantiationException | IllegalAccessException e) {
            throw new IllegalStateException("the " + wireName + " record cannot be built from its components", e);
        } catch (InvocationTargetException e) {
            throw new IllegalStateException("the " + wireName + " record rejected its components", e.getCause());
        }
    }
}
