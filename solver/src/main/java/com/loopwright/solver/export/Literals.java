package com.loopwright.solver.export;

import java.util.ArrayList;
import java.util.List;

/** Number literals and comment text valid in both IEC 61131-3 ST and C. */
final class Literals {

    /** Longest comment line before wrapping. */
    static final int COMMENT_WIDTH = 100;

    private Literals() {}

    /** Shortest round-trip decimal of a finite double, always with a '.' (e.g. 400.0, 1.0E-4). */
    static String real(double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("cannot write a non-finite constant: " + value);
        }
        return Double.toString(value);
    }

    /** The value itself, checked finite. */
    static double realValue(double value) {
        real(value);
        return value;
    }

    /** Text made safe inside a comment (no comment terminators, ASCII only), wrapped to COMMENT_WIDTH. */
    static List<String> commentLines(String text) {
        String safe = text.replace("*)", "* )")
                .replace("*/", "* /")
                .replace("(*", "( *")
                .replace("/*", "/ *")
                .replaceAll("[^\\x20-\\x7E]", "?");
        List<String> lines = new ArrayList<>();
        StringBuilder line = new StringBuilder();
        for (String word : safe.split(" ")) {
            if (line.length() > 0 && line.length() + 1 + word.length() > COMMENT_WIDTH) {
                lines.add(line.toString());
                line.setLength(0);
            }
            if (line.length() > 0) {
                line.append(' ');
            }
            line.append(word);
        }
        lines.add(line.toString());
        return lines;
    }
}
