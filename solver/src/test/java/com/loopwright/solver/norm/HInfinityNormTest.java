package com.loopwright.solver.norm;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.loopwright.solver.design.HInfinityNorm;
import org.junit.jupiter.api.Test;

class HInfinityNormTest {

    @Test
    void keepsComponents() {
        HInfinityNorm norm = new HInfinityNorm(3.37, 0.98, 4);
        assertEquals(3.37, norm.value());
        assertEquals(0.98, norm.peakFrequencyRadPerSec());
        assertEquals(4, norm.iterations());
    }

    @Test
    void rejectsNonFiniteOrNegativeComponents() {
        assertThrows(IllegalArgumentException.class, () -> new HInfinityNorm(Double.NaN, 1, 1));
        assertThrows(IllegalArgumentException.class, () -> new HInfinityNorm(Double.POSITIVE_INFINITY, 1, 1));
        assertThrows(IllegalArgumentException.class, () -> new HInfinityNorm(-1, 1, 1));
        assertThrows(IllegalArgumentException.class, () -> new HInfinityNorm(1, Double.POSITIVE_INFINITY, 1));
        assertThrows(IllegalArgumentException.class, () -> new HInfinityNorm(1, -1, 1));
        assertThrows(IllegalArgumentException.class, () -> new HInfinityNorm(1, 1, -1));
    }
}
