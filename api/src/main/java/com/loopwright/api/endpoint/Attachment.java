package com.loopwright.api.endpoint;

import java.util.regex.Pattern;

/**
 * A response body meant to be saved as a file: the body (a {@link Text}, or a record written as JSON with the
 * trace) and the file name the response's {@code Content-Disposition: attachment} header states.
 *
 * @param fileName the file name: letters, digits, '_', '-' and '.', at most {@value #MAX_FILE_NAME_LENGTH}
 *                 characters (so it needs no quoting or encoding in the header)
 * @param body     the body
 */
public record Attachment(String fileName, Object body) {

    /** Longest file name. */
    public static final int MAX_FILE_NAME_LENGTH = 64;

    private static final Pattern SAFE = Pattern.compile("[A-Za-z0-9_.-]{1," + MAX_FILE_NAME_LENGTH + "}");

    public Attachment {
        if (fileName == null || !SAFE.matcher(fileName).matches() || body == null || body instanceof Attachment) {
            throw new IllegalArgumentException("an attachment needs a plain file name and a body");
        }
    }
}
