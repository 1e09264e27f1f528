package com.loopwright.solver.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class NormalizedRiseTimeTest {

    // source: table of normalized 10-90% rise time wn*tr versus zeta for the standard second-order system
    // (Nise, Control Systems Engineering, figure "normalized rise time vs damping ratio"), from memory.
    @ParameterizedTest
    @CsvSource({
        "0.1, 1.104",
        "0.2, 1.203",
        "0.3, 1.321",
        "0.4, 1.463",
        "0.5, 1.638",
        "0.6, 1.854",
        "0.7, 2.126",
        "0.8, 2.467",
        "0.9, 2.883"
    })
    void matchesTabulatedValues(double zeta, double tabulated) {
        assertEquals(tabulated, NormalizedRiseTime.of(zeta), 2e-3);
    }

    // source: critically damped response y = 1 - e^-tau (1 + tau) (any control textbook), 10-90% rise 3.358.
    @ParameterizedTest
    @CsvSource({"1.0"})
    void criticallyDampedValue(double zeta) {
        assertEquals(3.3579, NormalizedRiseTime.of(zeta), 1e-3);
    }
}
