package com.loopwright.solver.fit;

/**
 * Step and impulse response of wn^2/(s^2 + 2 zeta wn s + wn^2) in normalized time tau = wn t, for any
 * zeta &gt;= 0, without the cancellation of the textbook formulas near zeta = 1:
 * <pre>
 *   S(tau) = 1 - e^{-zeta tau} (C(tau) + zeta N(tau)),   S'(tau) = e^{-zeta tau} N(tau),
 *   C = cos(w tau), N = sin(w tau)/w   (zeta &lt; 1, w = sqrt(1 - zeta^2)),
 *   C = cosh(w tau), N = sinh(w tau)/w (zeta &gt; 1, w = sqrt(zeta^2 - 1)),
 * </pre>
 * with the Taylor series in q tau^2 (q = zeta^2 - 1) when w tau is small, and the overdamped exponentials
 * combined so that nothing overflows. S = S' = 0 for tau &lt;= 0.
 */
final class UnitStepShape {

    /** Below this w tau the series C = 1 + q tau^2/2 + q^2 tau^4/24 + q^3 tau^6/720 is exact to rounding. */
    private static final double SERIES_LIMIT = 1e-2;

    private UnitStepShape() {}

    static double step(double tau, double zeta) {
        if (tau <= 0) {
            return 0;
        }
        double[] cn = envelopeTerms(tau, zeta);
        return 1 - (cn[0] + zeta * cn[1]);
    }

    static double impulse(double tau, double zeta) {
        if (tau <= 0) {
            return 0;
        }
        return envelopeTerms(tau, zeta)[1];
    }

    /** {e^{-zeta tau} C(tau), e^{-zeta tau} N(tau)}. */
    private static double[] envelopeTerms(double tau, double zeta) {
        double q = zeta * zeta - 1;
        double w = Math.sqrt(Math.abs(q));
        double wt = w * tau;
        if (wt < SERIES_LIMIT) {
            double x = q * tau * tau;
            double decay = Math.exp(-zeta * tau);
            double c = 1 + x / 2 + x * x / 24 + x * x * x / 720;
            double n = tau * (1 + x / 6 + x * x / 120 + x * x * x / 5040);
            return new double[] {decay * c, decay * n};
        }
        if (q < 0) {
            double decay = Math.exp(-zeta * tau);
            return new double[] {decay * Math.cos(wt), decay * Math.sin(wt) / w};
        }
        // zeta - w = 1/(zeta + w) avoids cancellation for large zeta.
        double slow = Math.exp(-tau / (zeta + w));
        double fast = Math.exp(-(zeta + w) * tau);
        return new double[] {0.5 * (slow + fast), (slow - fast) / (2 * w)};
    }
}
