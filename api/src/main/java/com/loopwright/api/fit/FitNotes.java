package com.loopwright.api.fit;

import java.util.List;
import java.util.stream.Stream;

/**
 * The notes of a fit response, each with a stable machine-readable code in a parallel list (same order), as the
 * notes and noteCodes of a design response.
 *
 * @param texts the notes, in engineering words
 * @param codes the code of each note, index for index
 */
public record FitNotes(List<String> texts, List<String> codes) {

    /** The logged input strays from an ideal step; the fit assumed the ideal step. */
    public static final String INPUT_NOT_CLEAN_STEP = "inputNotCleanStep";
    /** The fitted model is a plant that POST /v1/designs accepts as is (every fit). */
    public static final String FITTED_PLANT_FOR_DESIGN = "fittedPlantForDesign";

    public static final FitNotes NONE = new FitNotes(List.of(), List.of());

    public FitNotes {
        texts = List.copyOf(texts);
        codes = List.copyOf(codes);
        if (texts.size() != codes.size()) {
            throw new IllegalArgumentException("one code per note");
        }
    }

    /** These notes followed by one more. */
    public FitNotes with(String code, String text) {
        return new FitNotes(
                Stream.concat(texts.stream(), Stream.of(text)).toList(),
                Stream.concat(codes.stream(), Stream.of(code)).toList());
    }
}
