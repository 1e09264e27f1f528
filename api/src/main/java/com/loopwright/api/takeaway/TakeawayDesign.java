package com.loopwright.api.takeaway;

import com.loopwright.api.design.DesignRequest;
import com.loopwright.api.design.DesignRequestValidator;
import com.loopwright.api.design.ValidatedDesign;
import com.loopwright.api.endpoint.FailureContext;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.validation.InvalidRequestException;
import java.util.ArrayList;
import java.util.List;

/**
 * The design request a takeaway carries under "design": validated together with the wrapper's own fields (their
 * errors reported at once, the design's prefixed with /design), and the pointers its failures are reported at.
 */
final class TakeawayDesign {

    static final String PREFIX = "/design";
    /** Where the failures of a nested design point: under /design; an unstable band blames the box. */
    static final FailureContext CONTEXT =
            new FailureContext(PREFIX, "/spec/settlingTime", PREFIX + "/verify", PREFIX + "/verify/uncertainty");

    private final DesignRequestValidator validator = new DesignRequestValidator();

    /**
     * @param wrapperErrors field errors of the wrapper's own fields, reported with the design's
     * @throws InvalidRequestException with every field error
     */
    ValidatedDesign validate(DesignRequest request, List<FieldError> wrapperErrors) {
        ValidatedDesign validated = null;
        List<FieldError> errors = new ArrayList<>(wrapperErrors);
        if (request == null) {
            errors.add(new FieldError(PREFIX, "required: the design request as POST /v1/designs takes it"));
        } else {
            try {
                validated = validator.validate(request);
            } catch (InvalidRequestException e) {
                e.errors().forEach(f -> errors.add(new FieldError(PREFIX + f.pointer(), f.detail())));
            }
        }
        if (!errors.isEmpty()) {
            throw new InvalidRequestException(errors);
        }
        return validated;
    }

    static FailureContext context(ValidatedDesign validated) {
        return validated == null ? CONTEXT : CONTEXT.withTimeSpec(validated.timeSpecPointer());
    }

    static void optionalPositive(List<FieldError> errors, String pointer, Double value, double max) {
        if (value != null && !(value > 0 && value <= max)) {
            errors.add(new FieldError(pointer, "must be a finite number above 0 and at most " + max));
        }
    }
}
