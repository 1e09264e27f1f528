package com.loopwright.api.plant;

import com.loopwright.api.problem.FieldError;
import java.util.List;
import java.util.Optional;
import java.util.TreeSet;

/**
 * A plant object that makes no one form: no form named, an unknown form name, or fields of other forms beside the
 * chosen form's.
 * Decoding keeps it rather than failing, so that validation reports it as 400 field errors together with the
 * request's other field errors.
 *
 * @param form               the form name as sent; null when absent (a 400: every plant names its form)
 * @param fieldsOfOtherForms the fields present (non-null) that the chosen form does not take, in registry order
 */
public record UnmatchedPlant(String form, List<String> fieldsOfOtherForms) implements PlantInput {

    public UnmatchedPlant {
        fieldsOfOtherForms = List.copyOf(fieldsOfOtherForms);
    }

    @Override
    public ResolvedPlant resolve(List<FieldError> errors) {
        if (form == null) {
            errors.add(new FieldError(
                    "/plant/form", "required: the plant names its form, one of " + PlantFormName.wireNames()));
            return null;
        }
        Optional<PlantFormName> named = PlantFormName.ofWireName(form);
        if (named.isEmpty()) {
            errors.add(new FieldError("/plant/form", "unknown form; one of " + PlantFormName.wireNames()));
            return null;
        }
        PlantFormName chosen = named.get();
        for (String field : fieldsOfOtherForms) {
            errors.add(new FieldError(
                    "/plant/" + field,
                    "not a field of the " + chosen.wireName() + " form (its fields: " + new TreeSet<>(chosen.fields())
                            + ")"));
        }
        return null;
    }
}
