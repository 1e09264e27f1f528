package com.loopwright.api.validation;

import com.loopwright.api.problem.FieldError;
import java.util.List;

/** Shared field checks of the request validators of every endpoint, worded alike everywhere. */
public final class Checks {

    private Checks() {}

    /** Present (if required), finite, and minAbs &lt;= |value| &lt;= maxAbs. */
    public static void magnitude(
            List<FieldError> errors, String pointer, Double value, double minAbs, double maxAbs, boolean required) {
        if (value == null) {
            if (required) {
                errors.add(new FieldError(pointer, "required"));
            }
            return;
        }
        double abs = Math.abs(value);
        if (!Double.isFinite(value) || abs < minAbs || abs > maxAbs) {
            errors.add(new FieldError(
                    pointer,
                    minAbs > 0
                            ? "magnitude must be from " + fmt(minAbs) + " to " + fmt(maxAbs) + " (non-zero)"
                            : "magnitude must be at most " + fmt(maxAbs)));
        }
    }

    /** Present (if required), finite, and min &lt;= value &lt;= max. */
    public static void range(
            List<FieldError> errors, String pointer, Double value, double min, double max, boolean required) {
        if (value == null) {
            if (required) {
                errors.add(new FieldError(pointer, "required"));
            }
            return;
        }
        if (!Double.isFinite(value) || value < min || value > max) {
            errors.add(new FieldError(pointer, "must be a finite number from " + fmt(min) + " to " + fmt(max)));
        }
    }

    /** Absent, or positive, finite and at most max. */
    public static void positive(List<FieldError> errors, String pointer, Double value, double max) {
        if (value != null && !(value > 0 && value <= max)) {
            errors.add(new FieldError(pointer, "must be positive and at most " + fmt(max)));
        }
    }

    public static String fmt(double value) {
        return value == Math.rint(value) && Math.abs(value) < 1e6
                ? String.valueOf((long) value)
                : String.valueOf(value);
    }
}
