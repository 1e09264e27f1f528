package com.loopwright.api.takeaway;

import com.loopwright.api.endpoint.Reply;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/** The export formats of a controller: the path segment of POST /v1/designs/controllers/{format} and its type. */
enum ControllerFormat {
    /** An IEC 61131-3 function block (no registered media type for Structured Text: plain text). */
    STRUCTURED_TEXT("structured-text", "text/plain; charset=utf-8"),
    /** The C99 header: constants, state struct, prototypes. */
    C_HEADER("c-header", "text/x-c; charset=utf-8"),
    /** The C99 source: the init and step functions (includes the header). */
    C_SOURCE("c-source", "text/x-c; charset=utf-8"),
    /** A PLCopen TC6 XML 2.01 project holding the function block. */
    PLCOPEN_XML("plcopen-xml", "application/xml; charset=utf-8"),
    /** The law's numbers as JSON. */
    PARAMETERS("parameters", Reply.JSON);

    /** The path segments, in declaration order. */
    static final List<String> SLUGS =
            Arrays.stream(values()).map(ControllerFormat::slug).toList();

    private final String slug;
    private final String mediaType;

    ControllerFormat(String slug, String mediaType) {
        this.slug = slug;
        this.mediaType = mediaType;
    }

    String slug() {
        return slug;
    }

    String mediaType() {
        return mediaType;
    }

    static Optional<ControllerFormat> bySlug(String slug) {
        return Arrays.stream(values()).filter(f -> f.slug.equals(slug)).findFirst();
    }
}
