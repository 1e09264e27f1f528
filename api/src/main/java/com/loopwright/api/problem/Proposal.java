package com.loopwright.api.problem;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A nearby value the plant can meet.
 *
 * @param pointer the field to change
 * @param value   the proposed value, in that field's units
 * @param note    what is kept and why
 * @param spec    the caller's whole spec object (field name to value, in the request's order) with the proposed value
 *                in place, ready to send back; absent when the endpoint does not know the spec as sent
 */
@JsonInclude(JsonInclude.Include.NON_NULL)
public record Proposal(String pointer, double value, String note, Map<String, Double> spec) {

    public Proposal {
        spec = spec == null ? null : Collections.unmodifiableMap(new LinkedHashMap<>(spec));
    }

    /** A proposal of a value alone. */
    public Proposal(String pointer, double value, String note) {
        this(pointer, value, note, null);
    }
}
