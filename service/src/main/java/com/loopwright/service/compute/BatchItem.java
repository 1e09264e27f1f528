package com.loopwright.service.compute;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;

/**
 * One object item of a batch as its bytes {@code body[offset, offset + length)} in the request body, which the
 * envelope reader has already checked as strict JSON; decoded from there, so it needs no tree of its own.
 *
 * @param mapper the strict mapper that read the envelope (for {@link #tree()})
 */
public record BatchItem(ObjectMapper mapper, byte[] body, int offset, int length) {

    /** The item as a tree (for a computation that takes trees). */
    public JsonNode tree() {
        try {
            return mapper.readTree(body, offset, length);
        } catch (IOException e) {
            // The range was read once already by the same parser; it cannot fail now.
            throw new UncheckedIOException("a batch item could not be read again", e);
        }
    }
}
