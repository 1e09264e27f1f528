package com.loopwright.api.endpoint;

/**
 * A response body that is already text (SVG, source code): written as UTF-8 with its media type.
 *
 * @param mediaType the media type of the body
 * @param content   the text
 */
public record Text(String mediaType, String content) {}
