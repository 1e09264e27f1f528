package com.loopwright.solver.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/** Bisection in log x (common practice): n probes narrow [lo, hi] to the ratio (hi / lo)^(2^-n) around x*. */
class GeometricBisectionTest {

    @Test
    void theLowestTrueBracketsTheThresholdFromAboveWithinTheRatio() {
        AtomicInteger probes = new AtomicInteger();
        double found = GeometricBisection.lowestTrue(1, 256, 10, x -> {
            probes.incrementAndGet();
            return x >= Math.PI;
        });
        assertEquals(10, probes.get());
        assertTrue(found >= Math.PI, "on the true side: " + found);
        assertTrue(found / Math.PI <= Math.pow(256, Math.pow(2, -10)), "within the ratio: " + found);
    }

    @Test
    void theHighestTrueBracketsTheThresholdFromBelowWithinTheRatio() {
        double found = GeometricBisection.highestTrue(0.01, 100, 20, x -> x <= 7.5);
        assertTrue(found <= 7.5, "on the true side: " + found);
        assertTrue(7.5 / found <= Math.pow(1e4, Math.pow(2, -20)), "within the ratio: " + found);
    }

    @Test
    void zeroHalvingsProbeNothingAndReturnTheKnownEnd() {
        assertEquals(256, GeometricBisection.lowestTrue(1, 256, 0, x -> {
            throw new AssertionError("probed");
        }));
        assertEquals(1, GeometricBisection.highestTrue(1, 256, 0, x -> {
            throw new AssertionError("probed");
        }));
    }
}
