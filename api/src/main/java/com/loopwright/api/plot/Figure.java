package com.loopwright.api.plot;

import java.util.Arrays;
import java.util.Optional;

/** The figures a design can be drawn as; the slug is the path segment of POST /v1/designs/plots/{figure}. */
public enum Figure {
    STEP_RESPONSE("step-response"),
    CONTROL_EFFORT("control-effort"),
    BODE("bode"),
    UNCERTAINTY_BAND("uncertainty-band");

    private final String slug;

    Figure(String slug) {
        this.slug = slug;
    }

    public String slug() {
        return slug;
    }

    public static Optional<Figure> ofSlug(String slug) {
        return Arrays.stream(values()).filter(f -> f.slug.equals(slug)).findFirst();
    }
}
