package com.loopwright.api.plant;

import com.loopwright.api.problem.FieldError;
import java.util.List;

/** The magnitude check of the plant fields, worded like every other field check of the requests. */
final class PlantFieldChecks {

    private PlantFieldChecks() {
    }

    /** Present (if required), finite, and minAbs &lt;= |value| &lt;= maxAbs. */
    static void magnitude(List<FieldError> errors, String pointer, Double value, double minAbs, double maxAbs,
                          boolean required) {
        if (value == null) {
            if (required) {
                errors.add(new FieldError(pointer, "required"));
            }
            return;
        }
        double abs = Math.abs(value);
        if (!Double.isFinite(value) || abs < minAbs || abs > maxAbs) {
            errors.add(new FieldError(pointer, minAbs > 0
                    ? "magnitude must be from " + fmt(minAbs) + " to " + fmt(maxAbs) + " (non-zero)"
                    : "magnitude must be at most " + fmt(maxAbs)));
        }
    }

    static String fmt(double value) {
        return value == Math.rint(value) && Math.abs(value) < 1e6 ? String.valueOf((long) value)
                : String.valueOf(value);
    }
}
