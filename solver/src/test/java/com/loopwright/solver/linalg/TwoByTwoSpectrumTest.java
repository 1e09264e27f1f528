package com.loopwright.solver.linalg;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.hipparchus.complex.Complex;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.EigenDecompositionNonSymmetric;
import org.junit.jupiter.api.Test;

class TwoByTwoSpectrumTest {

    @Test
    void matchesHipparchusEigenvaluesOnRandomMatrices() {
        // reference library: Hipparchus EigenDecompositionNonSymmetric (a Hessenberg-QR route)
        Random random = new Random(20261202);
        for (int trial = 0; trial < 2000; trial++) {
            double scale = Math.pow(10, -3 + 6 * random.nextDouble());
            double[][] entries = new double[2][2];
            for (double[] row : entries) {
                for (int j = 0; j < 2; j++) {
                    row[j] = scale * random.nextGaussian();
                }
            }
            TwoByTwoSpectrum spectrum = TwoByTwoSpectrum.of(new DMatrixRMaj(entries));
            Complex[] eigenvalues =
                    new EigenDecompositionNonSymmetric(new Array2DRowRealMatrix(entries)).getEigenvalues();
            double abscissa = Math.max(eigenvalues[0].getReal(), eigenvalues[1].getReal());
            double imaginary =
                    Math.max(Math.abs(eigenvalues[0].getImaginary()), Math.abs(eigenvalues[1].getImaginary()));
            assertEquals(abscissa, spectrum.abscissa(), 1e-12 * scale, "trial " + trial);
            assertEquals(imaginary, spectrum.maxImaginary(), 1e-7 * scale, "trial " + trial);
        }
    }

    @Test
    void textbookCases() {
        // source: companion matrix [[0, 1], [-wn^2, -2 zeta wn]] has poles -zeta wn +- j wn sqrt(1 - zeta^2)
        TwoByTwoSpectrum underdamped = TwoByTwoSpectrum.of(new DMatrixRMaj(new double[][] {{0, 1}, {-625, -40}}));
        assertEquals(-20, underdamped.abscissa(), 1e-14);
        assertEquals(15, underdamped.maxImaginary(), 1e-13);
        // a tiny real root next to a large one, -1e-9 and -1e9: det / (m - root) keeps the small one exact
        TwoByTwoSpectrum stiff = TwoByTwoSpectrum.of(new DMatrixRMaj(new double[][] {{0, 1}, {-1, -1e9 - 1e-9}}));
        assertEquals(-1e-9, stiff.abscissa(), 1e-24);
        assertEquals(0, stiff.maxImaginary());
        // repeated root -3 (Jordan block) and an unstable diagonal
        assertEquals(
                -3,
                TwoByTwoSpectrum.of(new DMatrixRMaj(new double[][] {{-3, 1}, {0, -3}}))
                        .abscissa());
        assertEquals(
                2,
                TwoByTwoSpectrum.of(new DMatrixRMaj(new double[][] {{2, 0}, {0, -5}}))
                        .abscissa());
        assertThrows(IllegalArgumentException.class, () -> TwoByTwoSpectrum.of(new DMatrixRMaj(3, 3)));
    }
}
