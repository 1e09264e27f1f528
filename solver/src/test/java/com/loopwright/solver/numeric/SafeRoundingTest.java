package com.loopwright.solver.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** Advised bounds printed with %.Ng parse back on the accepted side of the bound. */
class SafeRoundingTest {

    private static final int SAMPLES = 2000;

    // Reference: java.util.Formatter's %.4g (round half up) printed 0.019937 as 0.01994, above the bound; the
    // floor at 4 significant digits is 0.01993 (decimal arithmetic by hand).
    @Test
    void upperBoundIsRoundedDown() {
        assertEquals(0.01993, SafeRounding.atMost(0.0199376, 4));
        assertEquals(0.01994, SafeRounding.atLeast(0.0199376, 4));
        assertEquals(-0.01994, SafeRounding.atMost(-0.0199376, 4));
    }

    // Brute force: random bounds over 12 decades; the printed advice, parsed as a caller would type it, is on the
    // accepted side and within one unit of the last printed digit.
    @Test
    void printedAdviceParsesOnTheAcceptedSide() {
        Random random = new Random(12);
        for (int i = 0; i < SAMPLES; i++) {
            double bound = Math.pow(10, -6 + 12 * random.nextDouble());
            for (int digits : new int[] {4, 6}) {
                double down = Double.parseDouble(
                        String.format(Locale.ROOT, "%." + digits + "g", SafeRounding.atMost(bound, digits)));
                double up = Double.parseDouble(
                        String.format(Locale.ROOT, "%." + digits + "g", SafeRounding.atLeast(bound, digits)));
                double unit = Math.pow(10, Math.floor(Math.log10(bound)) - digits + 1);
                assertTrue(down <= bound && bound - down <= unit * (1 + 1e-9), bound + " -> " + down);
                assertTrue(up >= bound && up - bound <= unit * (1 + 1e-9), bound + " -> " + up);
            }
        }
    }
}
