package com.loopwright.api.plant;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.Set;

/** The wire names of the plant descriptions and the fields each one takes. */
public enum PlantFormName {
    CANONICAL("canonical", Set.of("a0", "a1", "b", "d")),
    ROTARY_AXIS("rotaryAxis", Set.of("inertia", "viscousFriction", "torqueConstant", "gearRatio")),
    MASS_SPRING_DAMPER("massSpringDamper", Set.of("mass", "damping", "stiffness")),
    SECOND_ORDER_TRANSFER_FUNCTION("secondOrderTransferFunction",
            Set.of("gain", "naturalFrequency", "dampingRatio", "numerator", "denominator", "disturbanceNumerator")),
    STATE_SPACE("stateSpace", Set.of("a", "b2", "b1"));

    private final String wireName;
    private final Set<String> fields;

    PlantFormName(String wireName, Set<String> fields) {
        this.wireName = wireName;
        this.fields = fields;
    }

    public String wireName() {
        return wireName;
    }

    /** Fields this form takes (besides "form"). */
    public Set<String> fields() {
        return fields;
    }

    public static Optional<PlantFormName> ofWireName(String name) {
        return Arrays.stream(values()).filter(f -> f.wireName.equals(name)).findFirst();
    }

    public static List<String> wireNames() {
        return Arrays.stream(values()).map(PlantFormName::wireName).toList();
    }
}
