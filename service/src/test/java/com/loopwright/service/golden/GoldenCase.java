package com.loopwright.service.golden;

import java.util.Map;

/**
 * One recorded request of the golden corpus.
 *
 * @param id          file-name-safe identifier, unique in the corpus
 * @param server      {@link #OPEN} (authentication off) or {@link #KEYED} (API keys on)
 * @param method      HTTP method
 * @param path        request path
 * @param contentType Content-Type sent, or null for none
 * @param body        body sent as UTF-8 text, or null for none
 * @param headers     further request headers (copied)
 */
record GoldenCase(
        String id,
        String server,
        String method,
        String path,
        String contentType,
        String body,
        Map<String, String> headers) {

    /** The server with authentication off (the jar's default). */
    static final String OPEN = "open";
    /** The server with {@link #KEY} as its only API key. */
    static final String KEYED = "keyed";
    /** The API key of the keyed server (a test value, not a secret). */
    static final String KEY = "golden-corpus-test-key-0123456789";

    GoldenCase {
        if (!id.matches("[a-z0-9-]+")) {
            throw new IllegalArgumentException("case id must be file-name safe: " + id);
        }
        if (!server.equals(OPEN) && !server.equals(KEYED)) {
            throw new IllegalArgumentException("unknown server " + server);
        }
        headers = Map.copyOf(headers);
    }
}
