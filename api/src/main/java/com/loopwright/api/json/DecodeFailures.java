package com.loopwright.api.json;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.core.exc.InputCoercionException;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.core.exc.StreamReadException;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.exc.InvalidFormatException;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import com.fasterxml.jackson.databind.exc.UnrecognizedPropertyException;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import com.loopwright.api.problem.ProblemType;
import java.util.ArrayList;
import java.util.List;

/**
 * Turns a Jackson decoding failure into a 400 problem worded by us that names the field by its JSON pointer: no
 * parser text (source excerpt, line and column, token dumps, feature or class names) ever reaches a client.
 */
public final class DecodeFailures {

    /** Wrapped causes followed to find the parser's own failure. */
    private static final int MAX_CAUSE_DEPTH = 8;

    private DecodeFailures() {}

    public static Problem toProblem(JsonProcessingException failure) {
        if (causeOfType(failure, StreamConstraintsException.class) != null) {
            String detail = "the body exceeds a structural limit (nesting depth at most " + StrictJson.MAX_NESTING_DEPTH
                    + ", numbers at most " + StrictJson.MAX_NUMBER_LENGTH + " characters, strings at most "
                    + StrictJson.MAX_STRING_LENGTH + " characters)";
            return ProblemType.MALFORMED_REQUEST.problem(detail, List.of(new FieldError("", detail)), List.of());
        }
        StreamReadException parse = causeOfType(failure, StreamReadException.class);
        if (parse != null) {
            return parseProblem(parse);
        }
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
            return fieldProblem(pointer, detail);
        }
        String detail;
        if (failure instanceof JsonMappingException) {
            // Root-level mapping failures: an array, a scalar, or content after the object.
            detail = "the body must be exactly one JSON object with plant and spec";
        } else {
            detail = "not valid JSON";
        }
        return ProblemType.MALFORMED_REQUEST.problem(detail, List.of(new FieldError("", detail)), List.of());
    }

    /**
     * Whether the failure is at one field (an unknown member, a value of the wrong type or out of a whole-number
     * field's range) rather than in the JSON syntax or at the root: decoding can go on without that member
     * ({@link CollectingDecoder}).
     */
    static boolean isFieldFailure(JsonProcessingException failure) {
        if (causeOfType(failure, StreamConstraintsException.class) != null) {
            return false;
        }
        StreamReadException parse = causeOfType(failure, StreamReadException.class);
        if (parse != null) {
            return parse instanceof InputCoercionException
                    && parse.getProcessor() != null
                    && !pointerOf(parse.getProcessor().getParsingContext()).isEmpty();
        }
        return failure instanceof JsonMappingException mapping
                && !mapping.getPath().isEmpty();
    }

    /**
     * The 400 problem of a body that is not the JSON this endpoint takes, naming every error found (decoding errors
     * first, then the validation errors of what decoded); one error is worded as {@link #toProblem} words it.
     */
    public static Problem malformed(List<FieldError> errors) {
        if (errors.isEmpty()) {
            throw new IllegalArgumentException("a malformed request names at least one error");
        }
        List<FieldError> capped = errors.size() <= Problem.MAX_ERRORS ? errors : errors.subList(0, Problem.MAX_ERRORS);
        String detail;
        if (errors.size() == 1) {
            FieldError only = errors.get(0);
            detail = only.pointer().isEmpty() ? only.detail() : "field " + only.pointer() + ": " + only.detail();
        } else {
            detail = errors.size() + " fields are invalid; see errors"
                    + (errors.size() > Problem.MAX_ERRORS ? " (the first " + Problem.MAX_ERRORS + ")" : "");
        }
        return ProblemType.MALFORMED_REQUEST.problem(detail, capped, List.of());
    }

    private static Problem fieldProblem(String pointer, String detail) {
        if (pointer.isEmpty()) {
            String whole = "not valid JSON: " + detail;
            return ProblemType.MALFORMED_REQUEST.problem(whole, List.of(new FieldError("", whole)), List.of());
        }
        return ProblemType.MALFORMED_REQUEST.problem(
                "field " + pointer + ": " + detail, List.of(new FieldError(pointer, detail)), List.of());
    }

    /** The parser's own failure (the failure itself or its cause), however deep a deserializer wrapped it. */
    private static <T extends Throwable> T causeOfType(Throwable failure, Class<T> type) {
        Throwable cause = failure;
        for (int depth = 0; cause != null && depth < MAX_CAUSE_DEPTH; depth++) {
            if (type.isInstance(cause)) {
                return type.cast(cause);
            }
            cause = cause.getCause();
        }
        return null;
    }

    /**
     * A syntax or limit failure of the parser, at the pointer of the value the parser was reading when it stopped
     * (a nested duplicate key, NaN or trailing comma is named where it is, not at its parent), worded by us: the
     * parser's own message (its source excerpt, line and column, its feature names) never reaches a client.
     */
    private static Problem parseProblem(StreamReadException parse) {
        String pointer = parse.getProcessor() == null
                ? ""
                : pointerOf(parse.getProcessor().getParsingContext());
        return fieldProblem(pointer, causeOf(parse));
    }

    /** Our words for the parser's failure; the message is only classified, never echoed. */
    static String causeOf(StreamReadException parse) {
        if (parse instanceof InputCoercionException) {
            return "the number is outside the range of this whole-number field";
        }
        String message = parse.getOriginalMessage() == null ? "" : parse.getOriginalMessage();
        if (message.startsWith("Duplicate field")) {
            return "duplicate key: this member appears more than once in its object; send it once";
        }
        if (message.contains("'NaN'") || message.contains("Infinity'")) {
            return "NaN and Infinity are not JSON numbers; send a finite number";
        }
        if (message.contains("end-of-input")) {
            return "the body ends before this value is complete (a truncated document)";
        }
        if (message.startsWith("Unexpected character ('}'") && message.contains("double-quote to start field name")) {
            return "a trailing comma after this member: a comma must be followed by another member; remove it";
        }
        if (message.startsWith("Unexpected character (']'") && message.contains("expected a value")) {
            return "a trailing comma before the end of the array: a comma must be followed by a value; remove it";
        }
        if (message.contains("expected a value")) {
            return "a value is missing here";
        }
        if (message.contains("Invalid numeric value") || message.contains("Numeric value")) {
            return "not a valid JSON number";
        }
        if (message.contains("Unrecognized token")) {
            return "not a JSON value (strings need double quotes; the only bare words are true, false and null)";
        }
        return "not valid JSON at this point (check quotes, commas, colons and brackets)";
    }

    /** RFC 6901 pointer of the value the parser was reading, e.g. /plant/a0 or /plant/numerator/1. */
    static String pointerOf(JsonStreamContext context) {
        List<String> segments = new ArrayList<>();
        JsonStreamContext level = context;
        for (int depth = 0; level != null && !level.inRoot() && depth <= StrictJson.MAX_NESTING_DEPTH; depth++) {
            if (level.inArray()) {
                segments.add(String.valueOf(Math.max(level.getCurrentIndex(), 0)));
            } else if (level.getCurrentName() != null) {
                segments.add(escaped(level.getCurrentName()));
            }
            level = level.getParent();
        }
        StringBuilder pointer = new StringBuilder();
        for (int i = segments.size() - 1; i >= 0; i--) {
            pointer.append('/').append(segments.get(i));
        }
        return pointer.toString();
    }

    private static String escaped(String name) {
        return name.replace("~", "~0").replace("/", "~1");
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
                pointer.append(escaped(reference.getFieldName()));
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
        if (target == boolean.class || target == Boolean.class) {
            return "true or false";
        }
        if (Number.class.isAssignableFrom(target) || target.isPrimitive()) {
            return "a JSON number";
        }
        if (target == String.class || target.isEnum()) {
            return "a JSON string";
        }
        if (target.isArray() || java.util.Collection.class.isAssignableFrom(target)) {
            return "a JSON array";
        }
        return "a JSON object";
    }
}
