package com.loopwright.solver.simulation;

/**
 * e^(A t) of a real 2 x 2 matrix A in closed form.
 *
 * <p>Math (Cayley-Hamilton): with m = tr A / 2 and D = A - m I, D^2 = q^2 I where
 * q^2 = ((a11 - a22) / 2)^2 + a12 a21 (the eigenvalues are m +- q). Hence
 * e^(A t) = e^(m t) [c(t) I + s(t) D] with, writing z = q^2 t^2,
 * c = sum_k z^k / (2k)! and s = t sum_k z^k / (2k + 1)!, i.e. c = cosh(q t), s = sinh(q t) / q
 * for q^2 > 0 and c = cos(w t), s = sin(w t) / w with w^2 = -q^2 for q^2 < 0. The series is used
 * for |z| <= 1, so repeated and nearly repeated eigenvalues (where q itself is known only to about
 * sqrt(eps) but z enters smoothly) are exact up to rounding. For z > 1 the exponentials are
 * combined, e^(m t) cosh(q t) = (e^(l1 t) + e^(l2 t)) / 2 and e^(m t) sinh(q t) / q =
 * (e^(l1 t) - e^(l2 t)) / (l1 - l2), so no cosh overflows against a vanishing e^(m t); the
 * eigenvalue of smaller magnitude is taken as det A / (the other) to avoid cancellation.
 *
 * <p>Immutable; {@link #at} writes into a caller's array and allocates nothing.
 */
final class TwoStateExponential {

    /** |z| = |q^2| t^2 up to which the power series is summed. */
    static final double SERIES_LIMIT = 1.0;

    /**
     * Terms of the series: z^k / (2k)! with |z| <= 1 is below 2^-53 / 100 for k >= 10, so 11
     * terms reach rounding.
     */
    private static final int SERIES_TERMS = 11;

    // 1 / (2k)! and 1 / (2k + 1)! for k = 0 .. SERIES_TERMS - 1.
    private static final double[] EVEN_FACTORIAL_INVERSE = new double[SERIES_TERMS];
    private static final double[] ODD_FACTORIAL_INVERSE = new double[SERIES_TERMS];

    static {
        double factorial = 1.0;
        for (int j = 0; j < 2 * SERIES_TERMS; j++) {
            if (j > 0) {
                factorial *= j;
            }
            if (j % 2 == 0) {
                EVEN_FACTORIAL_INVERSE[j / 2] = 1.0 / factorial;
            } else {
                ODD_FACTORIAL_INVERSE[j / 2] = 1.0 / factorial;
            }
        }
    }

    private final double halfTrace;
    private final double halfDifference;
    private final double a12;
    private final double a21;
    private final double discriminant;
    private final double determinant;

    /** A = [[a11, a12], [a21, a22]], all finite. */
    TwoStateExponential(double a11, double a12, double a21, double a22) {
        if (!Double.isFinite(a11) || !Double.isFinite(a12) || !Double.isFinite(a21) || !Double.isFinite(a22)) {
            throw new IllegalArgumentException("A must be finite");
        }
        this.halfTrace = 0.5 * (a11 + a22);
        this.halfDifference = 0.5 * (a11 - a22);
        this.a12 = a12;
        this.a21 = a21;
        this.discriminant = halfDifference * halfDifference + a12 * a21;
        this.determinant = a11 * a22 - a12 * a21;
        if (!Double.isFinite(halfTrace) || !Double.isFinite(discriminant) || !Double.isFinite(determinant)) {
            throw new IllegalArgumentException("A is too large for the closed-form exponential");
        }
    }

    /** q^2 = ((a11 - a22) / 2)^2 + a12 a21: eigenvalues m +- q, real for q^2 >= 0. */
    double discriminant() {
        return discriminant;
    }

    /**
     * Writes e^(A t) row-major into target[0..4): e11, e12, e21, e22.
     *
     * @param tSeconds finite time (any sign)
     */
    void at(double tSeconds, double[] target) {
        double t = tSeconds;
        double z = discriminant * t * t;
        double identityPart;
        double generatorPart;
        if (Math.abs(z) <= SERIES_LIMIT) {
            double even = EVEN_FACTORIAL_INVERSE[SERIES_TERMS - 1];
            double odd = ODD_FACTORIAL_INVERSE[SERIES_TERMS - 1];
            for (int k = SERIES_TERMS - 2; k >= 0; k--) {
                even = even * z + EVEN_FACTORIAL_INVERSE[k];
                odd = odd * z + ODD_FACTORIAL_INVERSE[k];
            }
            double scale = Math.exp(halfTrace * t);
            identityPart = scale * even;
            generatorPart = scale * odd * t;
        } else if (z < 0.0) {
            double w = Math.sqrt(-discriminant);
            double scale = Math.exp(halfTrace * t);
            identityPart = scale * Math.cos(w * t);
            generatorPart = scale * Math.sin(w * t) / w;
        } else {
            double q = Math.sqrt(discriminant);
            // l1, l2 = m +- q; the larger-magnitude one directly, the other as det / it.
            double large = halfTrace < 0.0 ? halfTrace - q : halfTrace + q;
            double small = large == 0.0 ? 0.0 : determinant / large;
            double eLarge = Math.exp(large * t);
            double eSmall = Math.exp(small * t);
            identityPart = 0.5 * (eLarge + eSmall);
            // (e^(l1 t) - e^(l2 t)) / (l1 - l2) with l1 - l2 = +-2q, sign matched to large - small.
            generatorPart = (eLarge - eSmall) / (halfTrace < 0.0 ? -2.0 * q : 2.0 * q);
        }
        target[0] = identityPart + generatorPart * halfDifference;
        target[1] = generatorPart * a12;
        target[2] = generatorPart * a21;
        target[3] = identityPart - generatorPart * halfDifference;
    }
}
