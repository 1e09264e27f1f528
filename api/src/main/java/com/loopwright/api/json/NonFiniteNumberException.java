package com.loopwright.api.json;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.JsonMappingException;

/** A NaN or an infinity met while writing a response; carries the JSON pointer of the value. */
public final class NonFiniteNumberException extends JsonMappingException {

    private static final long serialVersionUID = 1L;
    private final String pointer;

    NonFiniteNumberException(JsonGenerator generator, String pointer) {
        super(generator, "non-finite number at " + (pointer.isEmpty() ? "the root" : pointer));
        this.pointer = pointer;
    }

    /** JSON pointer of the offending value ("" for the root). */
    public String pointer() {
        return pointer;
    }

    /** The exception itself, or the first cause that is one (for example inside valueToTree's wrapper), or null. */
    public static NonFiniteNumberException in(Throwable failure) {
        for (Throwable t = failure; t != null; t = t.getCause()) {
            if (t instanceof NonFiniteNumberException found) {
                return found;
            }
            if (t.getCause() == t) {
                break;
            }
        }
        return null;
    }
}
