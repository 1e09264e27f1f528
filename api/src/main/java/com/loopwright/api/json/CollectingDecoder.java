package com.loopwright.api.json;

import com.fasterxml.jackson.core.JsonPointer;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.loopwright.api.problem.FieldError;
import com.loopwright.api.problem.Problem;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;

/**
 * Decoding that goes on past the first field it cannot take, so that one answer names every field error.
 *
 * <p>The strict mapper stops at the first unknown member or value of the wrong type. When it stopped at a field
 * (not in the JSON syntax), the body is read as a tree and decoded again: each failure is recorded at its pointer
 * and the offending member is taken out of the tree (an unknown member itself; for a value of the wrong type, the
 * member of the nearest enclosing object that holds it, so an array with a bad element goes whole), until the rest
 * decodes. The caller then validates what decoded and reports both lists in one problem; a validation error at or
 * below a member taken out repeats a decoding error ({@link Outcome#repeats}) and is left out.
 *
 * <p>A syntax error (a duplicate key, NaN, a trailing comma, a truncated document) ends the reading: nothing after
 * it can be read as JSON, so it is reported with the field errors found before it and nothing is validated. The
 * strict mapper stays the fast path: a body that decodes strictly never comes here. Stateless and thread-safe.
 */
public final class CollectingDecoder {

    /** Decoding errors collected at most (and decoding passes over the tree): Problem's cap on its errors. */
    public static final int MAX_DECODE_ERRORS = Problem.MAX_ERRORS;

    private final ObjectMapper mapper;

    /** @param mapper the strict mapper ({@link StrictJson}) */
    public CollectingDecoder(ObjectMapper mapper) {
        this.mapper = mapper;
    }

    /**
     * What could be decoded.
     *
     * @param request the request decoded without the offending members, or null when nothing more can be decoded
     *                (a syntax error, a body that is not an object, the cap reached): then nothing is validated
     * @param errors  the decoding errors in the order found, each at its pointer (at least one)
     * @param cleared the pointers of the members taken out of the body
     */
    public record Outcome<Q>(Q request, List<FieldError> errors, List<String> cleared) {
        public Outcome {
            errors = List.copyOf(errors);
            cleared = List.copyOf(cleared);
        }

        /** Whether a validation error repeats a decoding error: it is at or below a member taken out. */
        public boolean repeats(FieldError error) {
            for (String member : cleared) {
                if (error.pointer().equals(member) || error.pointer().startsWith(member + "/")) {
                    return true;
                }
            }
            return false;
        }
    }

    /** A body the strict mapper refused with {@code first}. */
    public <Q> Outcome<Q> afterFailure(byte[] body, Class<Q> type, JsonProcessingException first) {
        Problem firstProblem = DecodeFailures.toProblem(first);
        if (!DecodeFailures.isFieldFailure(first)) {
            return stopped(firstProblem.errors(), List.of());
        }
        JsonNode tree;
        try {
            tree = mapper.readTree(body);
        } catch (JsonProcessingException syntax) {
            // A syntax error after the field error: both are named, and nothing after the syntax error.
            List<FieldError> errors = new ArrayList<>(firstProblem.errors());
            errors.addAll(DecodeFailures.toProblem(syntax).errors());
            return stopped(errors, List.of());
        } catch (IOException unreadable) {
            return stopped(firstProblem.errors(), List.of());
        }
        return collect(tree, type, firstProblem);
    }

    /** A parsed value (a batch item) the strict mapper refused with {@code first}; the item is not changed. */
    public <Q> Outcome<Q> afterFailure(JsonNode item, Class<Q> type, JsonProcessingException first) {
        Problem firstProblem = DecodeFailures.toProblem(first);
        if (!DecodeFailures.isFieldFailure(first)) {
            return stopped(firstProblem.errors(), List.of());
        }
        return collect(item.deepCopy(), type, firstProblem);
    }

    /** Decodes {@code tree} (owned: members are taken out of it) until it decodes or nothing more can be taken. */
    private <Q> Outcome<Q> collect(JsonNode tree, Class<Q> type, Problem firstProblem) {
        List<FieldError> errors = new ArrayList<>();
        List<String> cleared = new ArrayList<>();
        for (int pass = 0; pass < MAX_DECODE_ERRORS; pass++) {
            try {
                Q request = mapper.treeToValue(tree, type);
                return errors.isEmpty()
                        // Cannot happen for a body the strict mapper refused at a field; named all the same.
                        ? stopped(firstProblem.errors(), List.of())
                        : new Outcome<>(request, errors, cleared);
            } catch (JsonProcessingException failure) {
                List<FieldError> found = DecodeFailures.toProblem(failure).errors();
                errors.addAll(found);
                String member = DecodeFailures.isFieldFailure(failure) && found.size() == 1
                        ? takeOut(tree, found.get(0).pointer())
                        : null;
                if (member == null) {
                    return stopped(errors, cleared);
                }
                cleared.add(member);
            } catch (IllegalArgumentException failure) {
                // treeToValue's wrapper of a non-Jackson failure: nothing more is decoded.
                return stopped(errors.isEmpty() ? firstProblem.errors() : errors, cleared);
            }
        }
        return stopped(errors, cleared);
    }

    private static <Q> Outcome<Q> stopped(List<FieldError> errors, List<String> cleared) {
        return new Outcome<>(null, errors, cleared);
    }

    /**
     * Takes the member at {@code pointer}, or of the nearest enclosing object member, out of {@code tree}; its
     * pointer, or null when there is no such member (the failure is at the root).
     */
    static String takeOut(JsonNode tree, String pointer) {
        JsonPointer member = JsonPointer.compile(pointer);
        for (int depth = 0; !member.matches() && depth <= StrictJson.MAX_NESTING_DEPTH; depth++) {
            JsonPointer parent = member.head();
            JsonNode holder = tree.at(parent);
            if (holder instanceof ObjectNode object) {
                String name = member.last().getMatchingProperty();
                return object.remove(name) == null ? null : member.toString();
            }
            if (holder.isMissingNode()) {
                return null;
            }
            member = parent;
        }
        return null;
    }
}
