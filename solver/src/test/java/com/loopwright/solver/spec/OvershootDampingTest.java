package com.loopwright.solver.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class OvershootDampingTest {

    // source: standard textbook overshoot/damping tables (e.g. the %OS vs zeta table of any
    // introductory control text): 20% -> 0.456, 10% -> 0.591, 5% -> 0.690, to the 3 digits printed.
    @ParameterizedTest
    @CsvSource({"0.20, 0.456", "0.10, 0.591", "0.05, 0.690"})
    void matchesTextbookTable(double overshoot, double tabulatedZeta) {
        assertEquals(tabulatedZeta, OvershootDamping.dampingRatio(overshoot), 5e-4);
    }

    // common practice, from the formula: 0.1% overshoot needs zeta ~ 0.91, 2% needs zeta ~ 0.78.
    @ParameterizedTest
    @CsvSource({"0.001, 0.91", "0.02, 0.78"})
    void matchesRulesOfThumb(double overshoot, double zeta) {
        assertEquals(zeta, OvershootDamping.dampingRatio(overshoot), 5e-3);
    }

    // source: OS = exp(-pi zeta/sqrt(1 - zeta^2)) is the inverse of zeta = -ln OS / sqrt(pi^2 + ln^2 OS).
    @Test
    void roundTripsAcrossTheRange() {
        for (double os = 1e-6; os < 0.99; os *= 1.37) {
            double zeta = OvershootDamping.dampingRatio(os);
            assertEquals(os, OvershootDamping.overshoot(zeta), 1e-12 * Math.max(os, 1e-3));
        }
    }

    // source: the response of a loop with zeta >= 1 does not overshoot (any control textbook).
    @Test
    void noOvershootAtOrAboveCriticalDamping() {
        assertEquals(0, OvershootDamping.overshoot(1.0));
        assertEquals(0, OvershootDamping.overshoot(2.5));
    }

    @Test
    void rejectsOvershootOutsideTheOpenUnitInterval() {
        assertThrows(IllegalArgumentException.class, () -> OvershootDamping.dampingRatio(0));
        assertThrows(IllegalArgumentException.class, () -> OvershootDamping.dampingRatio(1));
        assertThrows(IllegalArgumentException.class, () -> OvershootDamping.dampingRatio(Double.NaN));
    }
}
