package com.loopwright.solver.linalg;

import org.ejml.data.DMatrixRMaj;

/**
 * Where the eigenvalues of a real 2 x 2 matrix lie, in closed form: lambda = m +- sqrt(q2) with m = tr A / 2
 * and q2 = ((a11 - a22) / 2)^2 + a12 a21 (= m^2 - det A, written without the cancellation of m^2 against det A).
 *
 * @param abscissa     largest real part of the eigenvalues
 * @param maxImaginary largest |imaginary part|, sqrt(-q2) for a complex pair, else 0
 */
public record TwoByTwoSpectrum(double abscissa, double maxImaginary) {

    /** @param a a 2 x 2 matrix with finite entries */
    public static TwoByTwoSpectrum of(DMatrixRMaj a) {
        if (a.numRows != 2 || a.numCols != 2) {
            throw new IllegalArgumentException("matrix must be 2x2, got " + a.numRows + "x" + a.numCols);
        }
        double a11 = a.get(0, 0);
        double a12 = a.get(0, 1);
        double a21 = a.get(1, 0);
        double a22 = a.get(1, 1);
        double m = 0.5 * (a11 + a22);
        double halfDifference = 0.5 * (a11 - a22);
        double q2 = halfDifference * halfDifference + a12 * a21;
        if (q2 < 0.0) {
            return new TwoByTwoSpectrum(m, Math.sqrt(-q2));
        }
        double root = Math.sqrt(q2);
        // For m < 0 the larger root m + root may cancel; it equals det A / (m - root), det A = a11 a22 - a12 a21.
        double larger = m < 0.0 ? (a11 * a22 - a12 * a21) / (m - root) : m + root;
        return new TwoByTwoSpectrum(larger, 0.0);
    }
}
