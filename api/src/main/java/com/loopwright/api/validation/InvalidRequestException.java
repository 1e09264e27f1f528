package com.loopwright.api.validation;

import com.loopwright.api.problem.FieldError;
import java.util.List;

/** The request is well-formed JSON but some fields are missing, out of range or contradictory. */
public final class InvalidRequestException extends RuntimeException {

    private final transient List<FieldError> errors;

    public InvalidRequestException(List<FieldError> errors) {
        super(
                errors.isEmpty()
                        ? "invalid request"
                        : errors.get(0).pointer() + ": " + errors.get(0).detail());
        this.errors = List.copyOf(errors);
    }

    public List<FieldError> errors() {
        return errors;
    }
}
