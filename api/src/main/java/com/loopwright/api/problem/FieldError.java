package com.loopwright.api.problem;

/**
 * One offending field.
 *
 * @param pointer RFC 6901 JSON pointer into the request body, e.g. "/spec/overshootPercent"
 * @param detail  what is wrong, in engineering words
 */
public record FieldError(String pointer, String detail) {}
