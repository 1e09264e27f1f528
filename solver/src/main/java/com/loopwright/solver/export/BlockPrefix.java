package com.loopwright.solver.export;

import java.util.regex.Pattern;

/**
 * The caller-chosen name prefix of one exported axis: the function block is {@code <prefix>_Controller}, the C
 * functions {@code <prefix>_init} and {@code <prefix>_step}, the macros {@code <PREFIX>_...}, so several axes live
 * in one project. Valid in both IEC 61131-3 (letters, digits, single underscores, no leading or trailing
 * underscore, case-insensitive) and C (no reserved leading underscore).
 *
 * @param value the prefix, e.g. {@code Axis1}
 */
public record BlockPrefix(String value) {

    /** Longest prefix (keeps every derived name under 31 significant characters, the C99 external minimum). */
    public static final int MAX_LENGTH = 16;

    /** A letter, then letters or digits, with single underscores between them. */
    private static final Pattern IDENTIFIER = Pattern.compile("[A-Za-z][A-Za-z0-9]*(_[A-Za-z0-9]+)*");

    /** The prefix of today's exports. */
    public static final BlockPrefix DEFAULT = new BlockPrefix("LW");

    public BlockPrefix {
        if (value == null
                || value.isEmpty()
                || value.length() > MAX_LENGTH
                || !IDENTIFIER.matcher(value).matches()) {
            throw new IllegalArgumentException("the prefix must be 1 to " + MAX_LENGTH
                    + " characters: a letter, then letters, digits and single underscores, not ending in '_'");
        }
    }

    /** The upper-case form used in C macros. */
    public String macro() {
        return value.toUpperCase(java.util.Locale.ROOT);
    }

    /** The function block name. */
    public String blockName() {
        return value + "_Controller";
    }
}
