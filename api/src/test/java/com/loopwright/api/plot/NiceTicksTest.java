package com.loopwright.api.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** Nice-number ticks (common practice: steps of 1, 2 or 5 times a power of ten, axis widened to whole steps). */
class NiceTicksTest {

    @Test
    void handWorkedAxes() {
        // 0 .. 0.45 s in about 8 ticks: raw step 0.0643 -> 0.05; ticks 0.00 .. 0.45.
        NiceTicks time = NiceTicks.covering(0, 0.45, 8);
        assertEquals(0.05, time.step(), 1e-15);
        assertEquals(10, time.count());
        assertEquals("0.30", time.label(6));
        // -0.3 .. 1.57 in about 7 ticks: raw step 1.87 / 6 = 0.312, mantissa 3.12 lies in [3, 7) -> 5 x 0.1 = 0.5.
        NiceTicks effort = NiceTicks.covering(-0.3, 1.57, 7);
        assertEquals(0.5, effort.step(), 1e-15);
        assertEquals(-0.5, effort.start(), 1e-15);
        assertEquals(2.0, effort.end(), 1e-15);
        assertEquals("0.0", effort.label(1));
    }

    /** Independent property check on random ranges: nice step, covering, bounded count, clean labels. */
    @Test
    void randomRangesAreCoveredByNiceSteps() {
        Random random = new Random(7);
        for (int i = 0; i < 2000; i++) {
            double low = (random.nextDouble() - 0.5) * Math.pow(10, random.nextInt(12) - 6);
            double high = low + random.nextDouble() * Math.pow(10, random.nextInt(12) - 6);
            NiceTicks ticks = NiceTicks.covering(low, high, 7);
            double mantissa = ticks.step() / Math.pow(10, Math.floor(Math.log10(ticks.step()) + 1e-12));
            assertTrue(
                    Math.abs(mantissa - 1) < 1e-9
                            || Math.abs(mantissa - 2) < 1e-9
                            || Math.abs(mantissa - 5) < 1e-9
                            || Math.abs(mantissa - 10) < 1e-9,
                    "step " + ticks.step());
            assertTrue(
                    ticks.start() <= low + 1e-12 * Math.abs(low) && ticks.end() >= high - 1e-9 * ticks.step(),
                    low + ".." + high + " -> " + ticks);
            assertTrue(ticks.count() >= 2 && ticks.count() <= NiceTicks.MAX_TICKS);
            for (int k = 0; k < ticks.count(); k++) {
                assertTrue(ticks.label(k).length() < 16, ticks.label(k));
            }
        }
    }

    @Test
    void degenerateAndNonFiniteRanges() {
        NiceTicks flat = NiceTicks.covering(1, 1, 5);
        assertTrue(flat.start() < 1 && flat.end() > 1);
        assertThrows(IllegalArgumentException.class, () -> NiceTicks.covering(0, Double.NaN, 5));
    }
}
