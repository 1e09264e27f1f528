package com.loopwright.solver.fit;

/**
 * Unit step response of wn^2/(s^2 + 2 zeta wn s + wn^2) by the textbook case formulas (any control
 * textbook, e.g. Ogata, Modern Control Engineering, sec. 5-3), as an independent reference for the fit.
 */
final class TextbookStep {

    private TextbookStep() {}

    static double of(double t, double wn, double zeta) {
        if (t <= 0) {
            return 0;
        }
        if (zeta < 1) {
            double root = Math.sqrt(1 - zeta * zeta);
            return 1 - Math.exp(-zeta * wn * t) / root * Math.sin(wn * root * t + Math.acos(zeta));
        }
        if (zeta == 1) {
            return 1 - (1 + wn * t) * Math.exp(-wn * t);
        }
        double root = Math.sqrt(zeta * zeta - 1);
        double s1 = wn * (zeta - root);
        double s2 = wn * (zeta + root);
        return 1 + (s1 * Math.exp(-s2 * t) - s2 * Math.exp(-s1 * t)) / (s2 - s1);
    }
}
