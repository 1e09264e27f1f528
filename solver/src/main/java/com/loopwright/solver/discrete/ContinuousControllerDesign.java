package com.loopwright.solver.discrete;

import java.util.OptionalDouble;

/**
 * A continuous-time output-feedback design on the plant x' = A x + B2 u, y = C x (y[0] the position):
 *
 * <pre>
 *   u   = kr r - K xh + ki xi          the law (xh = x when the full state is measured, C = I)
 *   xi' = r - y[0]                     integral action (present when ki is given)
 *   xh' = A xh + B2 u + L (y - C xh)   the observer (present when L has columns)
 * </pre>
 *
 * @param a               A, n x n
 * @param b2              B2, n (the command input)
 * @param measuredOutput  C, p x n
 * @param stateGain       K, n
 * @param integralGain    ki, or empty without integral action
 * @param observerGain    L, n x p, or n rows of length 0 when the full state is measured (then C must be I)
 * @param referenceGain   kr, the reference feedforward of the two-degree-of-freedom law
 */
public record ContinuousControllerDesign(
        double[][] a,
        double[] b2,
        double[][] measuredOutput,
        double[] stateGain,
        OptionalDouble integralGain,
        double[][] observerGain,
        double referenceGain) {

    public ContinuousControllerDesign {
        int n = b2.length;
        if (n < 1 || a.length != n || stateGain.length != n || observerGain.length != n) {
            throw new IllegalArgumentException("A, B2, K and L must agree on the order n");
        }
        a = deepCopy(a);
        b2 = b2.clone();
        measuredOutput = deepCopy(measuredOutput);
        stateGain = stateGain.clone();
        observerGain = deepCopy(observerGain);
    }

    /** Whether an observer estimates the state from y. */
    public boolean hasObserver() {
        return observerGain[0].length > 0;
    }

    @Override
    public double[][] a() {
        return deepCopy(a);
    }

    @Override
    public double[] b2() {
        return b2.clone();
    }

    @Override
    public double[][] measuredOutput() {
        return deepCopy(measuredOutput);
    }

    @Override
    public double[] stateGain() {
        return stateGain.clone();
    }

    @Override
    public double[][] observerGain() {
        return deepCopy(observerGain);
    }

    private static double[][] deepCopy(double[][] m) {
        double[][] c = new double[m.length][];
        for (int i = 0; i < m.length; i++) {
            c[i] = m[i].clone();
        }
        return c;
    }
}
