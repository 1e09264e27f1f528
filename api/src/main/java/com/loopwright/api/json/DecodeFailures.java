package com.loopwright.api.json;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.exc.InvalidFormatException;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import com.fasterxml.jackson.databind.exc.UnrecognizedPropertyException;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import java.util.List;

/** Turns a Jackson decoding failure into a 400 problem that names the field, without internal class names. */
public final class DecodeFailures {

    private DecodeFailures() {}

    public static Problem toProblem(JsonProcessingException failure) {
        if (failure instanceof JsonMappingException mapping
                && !mapping.getPath().isEmpty()) {
            String pointer = pointerOf(mapping);
            String detail;
            if (mapping instanceof UnrecognizedPropertyException unknown) {
                detail = "unknown field '" + unknown.getPropertyName() + "'";
            } else if (mapping instanceof InvalidFormatException || mapping instanceof MismatchedInputException) {
                detail = "wrong type: expected " + expected(mapping);
            } else {
                detail = "cannot be read";
            }
            return ProblemType.MALFORMED_REQUEST.problem(
                    "field " + pointer + ": " + detail, List.of(new FieldError(pointer, detail)), List.of());
        }
        String detail;
        if (failure instanceof StreamConstraintsException) {
            detail = "the body exceeds a structural limit (nesting depth at most " + StrictJson.MAX_NESTING_DEPTH
                    + ", numbers at most " + StrictJson.MAX_NUMBER_LENGTH + " characters)";
        } else if (failure instanceof JsonMappingException) {
            // Root-level mapping failures: an array, a scalar, or content after the object.
            detail = "the body must be exactly one JSON object with plant and spec";
        } else {
            detail = "not valid JSON: " + firstLine(failure.getOriginalMessage());
        }
        return ProblemType.MALFORMED_REQUEST.problem(detail, List.of(new FieldError("", detail)), List.of());
    }

    /** The body could not be read at all (for example invalid UTF-8 that the decoder rejects). */
    public static Problem unreadable() {
        String detail = "the body could not be read as UTF-8 JSON";
        return ProblemType.MALFORMED_REQUEST.problem(detail, List.of(new FieldError("", detail)), List.of());
    }

    /** RFC 6901 pointer of the failing location, e.g. /spec/gamma. */
    static String pointerOf(JsonMappingException mapping) {
        StringBuilder pointer = new StringBuilder();
        for (JsonMappingException.Reference reference : mapping.getPath()) {
            pointer.append('/');
            if (reference.getFieldName() != null) {
                pointer.append(reference.getFieldName().replace("~", "~0").replace("/", "~1"));
            } else {
                pointer.append(Math.max(reference.getIndex(), 0));
            }
        }
        return pointer.toString();
    }

    private static String expected(JsonMappingException mapping) {
        Class<?> target = mapping instanceof MismatchedInputException mismatch ? mismatch.getTargetType() : null;
        if (target == null) {
            return "another JSON type";
        }
        if (target == Integer.class || target == Long.class || target == int.class || target == long.class) {
            return "a whole number (an integer, written without a fraction or exponent)";
        }
        if (Number.class.isAssignableFrom(target) || target.isPrimitive()) {
            return "a JSON number";
        }
        return "a JSON object";
    }

    private static String firstLine(String message) {
        if (message == null) {
            return "unreadable input";
        }
        int cut = message.indexOf('\n');
        // Jackson quotes types and features in backticks; none of that is the caller's business.
        String line = (cut < 0 ? message : message.substring(0, cut)).replaceAll("`[^`]*`", "value");
        // Jackson quotes the offending text; keep it short so nothing large is echoed back.
        return line.length() > 200 ? line.substring(0, 200) + "..." : line;
    }
}
