package com.loopwright.api.highorder;

import java.util.ArrayList;
import java.util.List;

/**
 * Polynomial coefficients on the wire are highest power first with the leading coefficient included; the solver's
 * companion plant keeps them lowest power first without the leading 1. These are the conversions between the two.
 */
final class CoefficientOrder {

    private CoefficientOrder() {}

    /**
     * [1, a_{n-1}, ..., a_0] of the monic s^n + a_{n-1} s^{n-1} + ... + a_0 from the solver's a_0 .. a_{n-1}.
     */
    static List<Double> monicHighestFirst(double[] lowestFirst) {
        List<Double> out = new ArrayList<>(lowestFirst.length + 1);
        out.add(1.0);
        for (int i = lowestFirst.length - 1; i >= 0; i--) {
            out.add(lowestFirst[i]);
        }
        return out;
    }

    /** The solver's a_0 .. a_{n-1} from the wire's [1, a_{n-1}, ..., a_0] (the leading 1 already checked). */
    static double[] fromMonicHighestFirst(double[] highestFirst) {
        int n = highestFirst.length - 1;
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            out[i] = highestFirst[n - i];
        }
        return out;
    }

    /**
     * The numerator c_{m-1} .. c_0 highest power first from the solver's c_0 .. c_{n-1}, leading zeros dropped
     * (c_0 is non-zero, so at least one entry stays).
     */
    static List<Double> numeratorHighestFirst(double[] lowestFirst) {
        int top = lowestFirst.length - 1;
        while (top > 0 && lowestFirst[top] == 0) {
            top--;
        }
        List<Double> out = new ArrayList<>(top + 1);
        for (int i = top; i >= 0; i--) {
            out.add(lowestFirst[i]);
        }
        return out;
    }

    /** The solver's c_0 .. c_{n-1} from a right-aligned, highest-first numerator of 1..n entries. */
    static double[] numeratorLowestFirst(double[] highestFirst, int n) {
        double[] out = new double[n];
        int m = highestFirst.length;
        for (int j = 0; j < m; j++) {
            out[j] = highestFirst[m - 1 - j];
        }
        return out;
    }
}
