package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.linalg.MatrixExponential;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class TwoStateExponentialTest {

    /** Agreement asked of Hipparchus' matrix exponential (see matchesPadeAndHipparchus). */
    private static final double HIPPARCHUS_TOLERANCE = 1e-10;

    private static double[] closedForm(double[][] a, double t) {
        double[] e = new double[4];
        new TwoStateExponential(a[0][0], a[0][1], a[1][0], a[1][1]).at(t, e);
        return e;
    }

    /** Reference 1: our Pade scaling-and-squaring MatrixExponential (on EJML) of A t. */
    private static double[] pade(double[][] a, double t) {
        DMatrixRMaj at = new DMatrixRMaj(a);
        for (int i = 0; i < 4; i++) {
            at.data[i] *= t;
        }
        return MatrixExponential.of(at).data;
    }

    /** Reference 2: Hipparchus MatrixUtils.matrixExponential of A t. */
    private static double[] hipparchus(double[][] a, double t) {
        RealMatrix at = MatrixUtils.createRealMatrix(a).scalarMultiply(t);
        RealMatrix e = MatrixUtils.matrixExponential(at);
        return new double[] {e.getEntry(0, 0), e.getEntry(0, 1), e.getEntry(1, 0), e.getEntry(1, 1)};
    }

    /** max_ij |x_ij - y_ij| / max_ij |y_ij|. */
    private static double relativeError(double[] x, double[] y) {
        double difference = 0;
        double scale = 0;
        for (int i = 0; i < 4; i++) {
            difference = Math.max(difference, Math.abs(x[i] - y[i]));
            scale = Math.max(scale, Math.abs(y[i]));
        }
        return difference / scale;
    }

    private static void assertClose(double[] expected, double[] actual, double tolerance, String what) {
        double error = relativeError(actual, expected);
        assertTrue(error <= tolerance, what + ": relative error " + error);
    }

    @ParameterizedTest
    @CsvSource({
        // a11, a12, a21, a22, t: q^2 > 0 (distinct real), q^2 < 0 (complex), q^2 = 0 (repeated)
        "0, 1, -4, -5, 0.3", // eigenvalues -1, -4
        "0, 1, -4, -5, 7.0",
        "-3, 2, 1, -8, 0.05",
        "-1000, 1, 0, -0.001, 2.0", // stiff: |z| = 2.5e5, slow eigenvalue via det / fast
        "0, 1, -629, -40, 0.001", // the indexing-axis loop (zeta 0.8, wn 25), one sample period
        "0, 1, -629, -40, 0.2",
        "0, 1, -100, -2, 3.0", // lightly damped: cos / sin branch
        "-0.5, 3, -3, -0.5, 10.0", // rotation with decay
        "0, 1, -100, -20, 0.37", // critically damped companion form, q^2 = 0 exactly
        "-2, 1, 0, -2, 1.5", // Jordan block
        "-2, 0, 0, -2, 1.5", // scalar matrix, D = 0
        "3, -1, 2, 0.5, 0.8", // unstable is fine for the exponential itself
        "0, 1, -1, 0, -2.0" // negative time
    })
    void matchesPadeAndHipparchus(double a11, double a12, double a21, double a22, double t) {
        // source: EJML-based MatrixExponential (Higham's scaling and squaring), tolerance
        // 1e-14 max(1, ||A t||) relative to max |entry| (backward stable to a few eps ||A t||), and
        // Hipparchus MatrixUtils.matrixExponential, tolerance 1e-10: Hipparchus is the less
        // accurate of the references here (measured 1.3e-11 on the decaying rotation at t = 10,
        // where a 40-digit mpmath expm agreed with the closed form to 1e-16).
        double[][] a = {{a11, a12}, {a21, a22}};
        double[] e = closedForm(a, t);
        double norm = Math.abs(t) * (Math.abs(a11) + Math.abs(a12) + Math.abs(a21) + Math.abs(a22));
        assertClose(pade(a, t), e, 1e-14 * Math.max(1, norm), "vs MatrixExponential");
        assertClose(hipparchus(a, t), e, HIPPARCHUS_TOLERANCE, "vs Hipparchus");
    }

    @Test
    void jordanBlockAndRotationMatchTheirTextbookForms() {
        // source: e^([[l, 1], [0, l]] t) = e^(l t) [[1, t], [0, 1]] and
        // e^([[s, w], [-w, s]] t) = e^(s t) [[cos wt, sin wt], [-sin wt, cos wt]], any linear
        // systems text (from memory).
        double l = -3.0;
        double t = 0.7;
        double decay = Math.exp(l * t);
        assertClose(
                new double[] {decay, t * decay, 0, decay},
                closedForm(new double[][] {{l, 1}, {0, l}}, t),
                4e-16,
                "Jordan block");
        double s = -0.2;
        double w = 5.0;
        double envelope = Math.exp(s * t);
        assertClose(
                new double[] {
                    envelope * Math.cos(w * t),
                    envelope * Math.sin(w * t),
                    -envelope * Math.sin(w * t),
                    envelope * Math.cos(w * t)
                },
                closedForm(new double[][] {{s, w}, {-w, s}}, t),
                1e-15,
                "rotation");
        // e^(A 0) = I exactly.
        double[] identity = closedForm(new double[][] {{-3, 2}, {1, -8}}, 0.0);
        assertEquals(1.0, identity[0]);
        assertEquals(0.0, identity[1]);
        assertEquals(0.0, identity[2]);
        assertEquals(1.0, identity[3]);
    }

    @ParameterizedTest
    @CsvSource({"1e-8", "-1e-8", "1e-6", "-1e-6", "1e-12", "-1e-12"})
    void nearlyRepeatedEigenvaluesStayExact(double qt) {
        // Companion form with poles -wn +- q, q t = the parameter (real for q^2 > 0, imaginary
        // otherwise): A = [[0, 1], [-(wn^2 - q^2), -2 wn]], q^2 = +-(qt / t)^2.
        // source: the exact response e^(At) = e^(-wn t) [c I + s (A + wn I)] with c = 1 + z / 2 + ...,
        // s = t (1 + z / 6 + ...), z = q^2 t^2 (Cayley-Hamilton, from memory), evaluated here as
        // the first three Taylor terms (the rest is below 1e-33 at |z| <= 1e-12); and the two
        // reference libraries.
        double wn = 40.0;
        double t = 0.05;
        double q2 = Math.signum(qt) * (qt / t) * (qt / t);
        double[][] a = {{0, 1}, {-(wn * wn - q2), -2 * wn}};
        double[] e = closedForm(a, t);
        double z = q2 * t * t;
        double c = 1 + z / 2 + z * z / 24;
        double s = t * (1 + z / 6 + z * z / 120);
        double scale = Math.exp(-wn * t);
        double[] expected = {scale * (c + s * wn), scale * s, scale * s * a[1][0], scale * (c + s * (a[1][1] + wn))};
        assertClose(expected, e, 4e-16, "Taylor form");
        double norm = t * (1 + Math.abs(a[1][0]) + Math.abs(a[1][1]));
        assertClose(pade(a, t), e, 1e-14 * norm, "vs MatrixExponential");
        assertClose(hipparchus(a, t), e, HIPPARCHUS_TOLERANCE, "vs Hipparchus");
    }

    @Test
    void seriesAndClosedBranchesAgreeAtTheSwitch() {
        // source: continuity of c(z), s(z) at |z| = SERIES_LIMIT; the reference is
        // MatrixExponential on either side.
        for (double sign : new double[] {1, -1}) {
            for (double z : new double[] {
                Math.nextDown(TwoStateExponential.SERIES_LIMIT), Math.nextUp(TwoStateExponential.SERIES_LIMIT)
            }) {
                double t = 0.5;
                double q2 = sign * z / (t * t);
                // A = [[d, 1], [q^2 - d^2, -d]] - I has D^2 = q^2 I.
                double d = 0.3;
                double[][] a = {{d - 1, 1}, {q2 - d * d, -d - 1}};
                assertClose(pade(a, t), closedForm(a, t), 2e-15, "z = " + sign * z);
            }
        }
    }

    @Test
    void randomMatricesMatchPade() {
        // source: MatrixExponential (EJML) on 2000 random Gaussian 2 x 2 matrices and times in
        // [0, 3]; tolerance 1e-14 max(1, ||A t||) relative to the largest entry, as for the
        // parameterised cases.
        Random random = new Random(8L);
        for (int i = 0; i < 2000; i++) {
            double[][] a = {
                {random.nextGaussian(), random.nextGaussian()}, {random.nextGaussian(), random.nextGaussian()}
            };
            double t = 3 * random.nextDouble();
            double norm = t * (Math.abs(a[0][0]) + Math.abs(a[0][1]) + Math.abs(a[1][0]) + Math.abs(a[1][1]));
            assertClose(pade(a, t), closedForm(a, t), 1e-14 * Math.max(1, norm), "case " + i);
        }
    }

    @Test
    void rejectsNonFiniteMatrices() {
        assertThrows(IllegalArgumentException.class, () -> new TwoStateExponential(Double.NaN, 0, 0, 0));
        assertThrows(IllegalArgumentException.class, () -> new TwoStateExponential(0, Double.POSITIVE_INFINITY, 0, 0));
        assertThrows(IllegalArgumentException.class, () -> new TwoStateExponential(1e308, 1e308, 1e308, 1e308));
    }
}
