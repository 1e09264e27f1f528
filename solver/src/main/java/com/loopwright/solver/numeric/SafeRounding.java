package com.loopwright.solver.numeric;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Rounds advised limits toward the safe side at the precision they are printed with, so that a value copied from
 * the advice is accepted: an upper bound ("at most X") is rounded down, a lower bound ("at least X") up.
 * The result prints exactly with {@code %.<digits>g}. Decimal parsing is monotone, so a caller who types the
 * printed digits gets a double on the same side of the bound as the printed value.
 */
public final class SafeRounding {

    /** Most significant digits a bound is rounded to. */
    public static final int MAX_DIGITS = 17;

    private SafeRounding() {}

    /** The largest value with {@code digits} significant digits that is at most {@code bound}. */
    public static double atMost(double bound, int digits) {
        return rounded(bound, digits, RoundingMode.FLOOR);
    }

    /** The smallest value with {@code digits} significant digits that is at least {@code bound}. */
    public static double atLeast(double bound, int digits) {
        return rounded(bound, digits, RoundingMode.CEILING);
    }

    private static double rounded(double bound, int digits, RoundingMode mode) {
        if (digits < 1 || digits > MAX_DIGITS) {
            throw new IllegalArgumentException("digits must be 1 to " + MAX_DIGITS);
        }
        if (!Double.isFinite(bound) || bound == 0) {
            return bound;
        }
        // new BigDecimal(double) is the exact binary value, so the decimal rounding is exact; doubleValue() of a
        // decimal with at most 17 digits rounds to nearest, which stays on the bound's side (monotone rounding)
        return new BigDecimal(bound).round(new MathContext(digits, mode)).doubleValue();
    }
}
