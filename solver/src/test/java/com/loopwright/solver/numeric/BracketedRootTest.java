package com.loopwright.solver.numeric;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class BracketedRootTest {

    /** x^2 - 2 on [1, 2]: the root is Math.sqrt(2) (correctly rounded by IEEE 754). */
    @Test
    void bothRulesFindTheSquareRootOfTwo() {
        double root = Math.sqrt(2);
        double bisection = BracketedRoot.bisection(x -> x * x - 2, 1, 2);
        double brent = BracketedRoot.brent(x -> x * x - 2, 1, 2, -1, 2);
        // bisection runs until the bracket is two adjacent doubles; zeroin stops within a few ulps
        assertTrue(Math.abs(bisection - root) <= Math.ulp(root), "bisection " + bisection);
        assertTrue(Math.abs(brent - root) <= 4 * Math.ulp(root), "brent " + brent);
    }

    /** cos x = x: the Dottie number 0.7390851332151607 (from memory; the fixed point of cosine). */
    @Test
    void bothRulesFindTheFixedPointOfCosine() {
        double bisection = BracketedRoot.bisection(x -> Math.cos(x) - x, 0, 1);
        double brent = BracketedRoot.brent(x -> Math.cos(x) - x, 0, 1, 1, Math.cos(1) - 1);
        assertEquals(0.7390851332151607, bisection, 2e-16);
        assertEquals(0.7390851332151607, brent, 4e-16);
    }

    @Test
    void endsWithoutSignChangeAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> BracketedRoot.bisection(x -> x * x + 1, -1, 1));
        assertThrows(IllegalArgumentException.class, () -> BracketedRoot.brent(x -> x * x + 1, -1, 1, 2, 2));
        assertEquals(0, BracketedRoot.bisection(x -> x, 0, 1));
        assertEquals(1, BracketedRoot.brent(x -> x - 1, 0, 1, -1, 0));
    }
}
