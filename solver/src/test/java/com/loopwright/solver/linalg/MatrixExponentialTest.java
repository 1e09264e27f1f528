package com.loopwright.solver.linalg;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class MatrixExponentialTest {

    /** ||actual - expected||_F / ||expected||_F. */
    static double relativeError(DMatrixRMaj actual, DMatrixRMaj expected) {
        DMatrixRMaj difference = new DMatrixRMaj(expected.numRows, expected.numCols);
        CommonOps_DDRM.subtract(actual, expected, difference);
        return NormOps_DDRM.normF(difference) / NormOps_DDRM.normF(expected);
    }

    @ParameterizedTest
    @ValueSource(doubles = {1e-3, 0.1, 0.9, 2.0, 5.0, 10.0, 100.0})
    void skewSymmetricGeneratorGivesRotationMatrix(double angleRadians) {
        // source: e^([[0, w], [-w, 0]] t) = [[cos wt, sin wt], [-sin wt, cos wt]], the rotation
        // matrix (solution of the harmonic oscillator x1' = w x2, x2' = -w x1).
        double angularRate = 3.0; // rad/s
        double timeSeconds = angleRadians / angularRate;
        DMatrixRMaj generator =
                new DMatrixRMaj(new double[][] {{0.0, angularRate * timeSeconds}, {-angularRate * timeSeconds, 0.0}});
        DMatrixRMaj expected = new DMatrixRMaj(new double[][] {
            {Math.cos(angleRadians), Math.sin(angleRadians)},
            {-Math.sin(angleRadians), Math.cos(angleRadians)}
        });
        DMatrixRMaj actual = MatrixExponential.of(generator);
        // Tolerance 1e-15 + 4 wt eps: the angle wt itself is only known to wt eps absolute.
        // Measured: <= 2.1e-16 up to wt = 10, 2.0e-15 at wt = 100.
        double tolerance = 1e-15 + 4.0 * angleRadians * Math.ulp(1.0);
        assertTrue(relativeError(actual, expected) <= tolerance, "relative error " + relativeError(actual, expected));
    }

    @ParameterizedTest
    @ValueSource(doubles = {-50.0, -1.0, 0.0, 1e-3, 0.7, 10.0, 700.0})
    void oneByOneMatchesScalarExponential(double exponent) {
        // source: for a 1 x 1 matrix, e^[a] = [e^a] (java.lang.Math.exp is within 1 ulp).
        DMatrixRMaj actual = MatrixExponential.of(new DMatrixRMaj(new double[][] {{exponent}}));
        double expected = Math.exp(exponent);
        // Tolerance: e^a has relative condition number |a| (a relative perturbation eps of a
        // changes e^a by |a| eps), so the bound is 1e-15 + 4 |a| eps; measured 1.0e-13 at a = 700.
        double tolerance = 1e-15 + 4.0 * Math.abs(exponent) * Math.ulp(1.0);
        assertEquals(expected, actual.get(0, 0), tolerance * expected);
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.01, 0.2, 0.9, 2.0, 5.0, 30.0, 200.0})
    void symmetricMatrixMatchesEigenDecomposition(double targetOneNorm) {
        // source: a real symmetric S = V diag(lambda) V^T with orthogonal V, so
        // e^S = V diag(e^lambda) V^T (spectral theorem). The norms cover each Pade degree
        // 3, 5, 7, 9 and the degree-13 branch with 0, 3 and 6 squarings.
        Random random = new Random(20240601L + (long) (targetOneNorm * 1000));
        int n = 6;
        DMatrixRMaj symmetric = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double entry = random.nextGaussian();
                symmetric.set(i, j, entry);
                symmetric.set(j, i, entry);
            }
        }
        CommonOps_DDRM.scale(targetOneNorm / NormOps_DDRM.inducedP1(symmetric), symmetric);

        EigenDecomposition_F64<DMatrixRMaj> eigen = DecompositionFactory_DDRM.eig(n, true, true);
        assertTrue(eigen.decompose(symmetric.copy()));
        DMatrixRMaj vectors = new DMatrixRMaj(n, n);
        DMatrixRMaj scaledVectors = new DMatrixRMaj(n, n);
        for (int k = 0; k < n; k++) {
            DMatrixRMaj vector = eigen.getEigenVector(k);
            double norm = NormOps_DDRM.normF(vector);
            double exponential = Math.exp(eigen.getEigenvalue(k).getReal());
            for (int i = 0; i < n; i++) {
                vectors.set(i, k, vector.get(i) / norm);
                scaledVectors.set(i, k, exponential * vector.get(i) / norm);
            }
        }
        DMatrixRMaj expected = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransB(scaledVectors, vectors, expected);

        double error = relativeError(MatrixExponential.of(symmetric), expected);
        // Tolerance 1e-14 + 4 ||S||_1 eps: e^lambda has relative condition number |lambda|, and
        // the reference's eigenvalues carry errors ~ eps ||S||. Measured: <= 1.4e-15 up to
        // ||S||_1 = 5, 6.5e-15 at 30, 4.7e-14 at 200 (bound 1.9e-13).
        double tolerance = 1e-14 + 4.0 * targetOneNorm * Math.ulp(1.0);
        assertTrue(error <= tolerance, "relative error " + error + " at norm " + targetOneNorm);
    }

    @Test
    void strictlyUpperTriangularMatrixMatchesFiniteSeries() {
        // source: a strictly upper triangular n x n matrix N is nilpotent (N^n = 0), so the
        // exponential series terminates: e^N = sum_{k=0}^{n-1} N^k / k!.
        Random random = new Random(7L);
        int n = 6;
        DMatrixRMaj nilpotent = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                nilpotent.set(i, j, 3.0 * random.nextGaussian());
            }
        }
        DMatrixRMaj expected = CommonOps_DDRM.identity(n);
        DMatrixRMaj term = CommonOps_DDRM.identity(n);
        DMatrixRMaj next = new DMatrixRMaj(n, n);
        for (int k = 1; k < n; k++) {
            CommonOps_DDRM.mult(1.0 / k, term, nilpotent, next);
            term.setTo(next);
            CommonOps_DDRM.addEquals(expected, term);
        }
        assertTrue(NormOps_DDRM.inducedP1(nilpotent) > 5.372, "exercise the scaling branch");
        double error = relativeError(MatrixExponential.of(nilpotent), expected);
        // Measured 2.0e-16.
        assertTrue(error <= 1e-13, "relative error " + error);
    }

    @Test
    void jordanBlockMatchesClosedForm() {
        // source: for a Jordan block J = lambda I + N (ones on the superdiagonal),
        // (e^(J t))_ij = e^(lambda t) t^(j-i) / (j-i)! for j >= i, and 0 below the diagonal.
        double eigenvalue = -2.0;
        double timeSeconds = 3.0;
        int n = 5;
        DMatrixRMaj jordanTimesT = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            jordanTimesT.set(i, i, eigenvalue * timeSeconds);
            if (i + 1 < n) {
                jordanTimesT.set(i, i + 1, timeSeconds);
            }
        }
        DMatrixRMaj expected = new DMatrixRMaj(n, n);
        for (int i = 0; i < n; i++) {
            double factorial = 1.0;
            for (int j = i; j < n; j++) {
                if (j > i) {
                    factorial *= j - i;
                }
                expected.set(i, j, Math.exp(eigenvalue * timeSeconds) * Math.pow(timeSeconds, j - i) / factorial);
            }
        }
        double error = relativeError(MatrixExponential.of(jordanTimesT), expected);
        // Measured 1.8e-16.
        assertTrue(error <= 1e-13, "relative error " + error);
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.5, 3.0, 12.0})
    void exponentialOfNegatedMatrixIsInverse(double targetOneNorm) {
        // source: A and -A commute, so e^A e^-A = e^0 = I.
        Random random = new Random(42L + (long) targetOneNorm);
        int n = 8;
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        for (int i = 0; i < a.getNumElements(); i++) {
            a.data[i] = random.nextGaussian();
        }
        CommonOps_DDRM.scale(targetOneNorm / NormOps_DDRM.inducedP1(a), a);
        DMatrixRMaj minusA = a.copy();
        CommonOps_DDRM.scale(-1.0, minusA);
        DMatrixRMaj forward = MatrixExponential.of(a);
        DMatrixRMaj backward = MatrixExponential.of(minusA);
        DMatrixRMaj product = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(forward, backward, product);
        DMatrixRMaj difference = product.copy();
        CommonOps_DDRM.subtractEquals(difference, CommonOps_DDRM.identity(n));
        // The rounding in a product of two matrices is bounded by ~n eps ||e^A|| ||e^-A||, so
        // the check is relative to that scale: 1e-14 * ||e^A||_F ||e^-A||_F.
        double scale = NormOps_DDRM.normF(forward) * NormOps_DDRM.normF(backward);
        double error = NormOps_DDRM.normF(difference) / scale;
        // Measured <= 1.2e-16.
        assertTrue(error <= 1e-14, "scaled error " + error);
    }

    @Test
    void zeroMatrixGivesIdentityAndArgumentIsUntouched() {
        // source: e^0 = I.
        DMatrixRMaj zero = new DMatrixRMaj(3, 3);
        DMatrixRMaj result = MatrixExponential.of(zero);
        assertEquals(0.0, relativeError(result, CommonOps_DDRM.identity(3)));
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{1, 2}, {3, 4}});
        DMatrixRMaj copy = a.copy();
        MatrixExponential.of(a);
        assertEquals(0.0, relativeError(a, copy));
    }

    @Test
    void rejectsBadArguments() {
        assertThrows(IllegalArgumentException.class, () -> MatrixExponential.of(null));
        assertThrows(IllegalArgumentException.class, () -> MatrixExponential.of(new DMatrixRMaj(2, 3)));
        assertThrows(IllegalArgumentException.class, () -> MatrixExponential.of(new DMatrixRMaj(33, 33)));
        assertThrows(
                IllegalArgumentException.class,
                () -> MatrixExponential.of(new DMatrixRMaj(new double[][] {{1, Double.NaN}, {0, 1}})));
        assertThrows(
                IllegalArgumentException.class,
                () -> MatrixExponential.of(new DMatrixRMaj(new double[][] {{Double.POSITIVE_INFINITY}})));
        // ||A||_1 = 1e21 needs more than 64 squarings.
        assertThrows(
                IllegalArgumentException.class, () -> MatrixExponential.of(new DMatrixRMaj(new double[][] {{-1e21}})));
        // e^710 exceeds Double.MAX_VALUE (about e^709.78): overflow is reported, not returned.
        assertThrows(
                IllegalArgumentException.class, () -> MatrixExponential.of(new DMatrixRMaj(new double[][] {{710.0}})));
    }
}
