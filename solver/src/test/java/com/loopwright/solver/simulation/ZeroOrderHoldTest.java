package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.loopwright.solver.linalg.MatrixExponential;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class ZeroOrderHoldTest {

    private static void assertMatrixEquals(DMatrixRMaj expected, DMatrixRMaj actual, double relativeTolerance) {
        assertEquals(expected.numRows, actual.numRows);
        assertEquals(expected.numCols, actual.numCols);
        for (int i = 0; i < expected.numRows; i++) {
            for (int j = 0; j < expected.numCols; j++) {
                double want = expected.get(i, j);
                assertEquals(
                        want,
                        actual.get(i, j),
                        relativeTolerance * Math.max(1.0, Math.abs(want)),
                        "entry (" + i + ", " + j + ")");
            }
        }
    }

    @ParameterizedTest
    @ValueSource(doubles = {1e-3, 0.1, 1.0, 7.5})
    void doubleIntegrator(double periodSeconds) {
        // source: ZOH of the double integrator x1' = x2, x2' = u, any digital control textbook:
        // Ad = [[1, T], [0, 1]], Bd = [T^2/2, T]'.
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{0, 1}, {0, 0}});
        DMatrixRMaj b = new DMatrixRMaj(new double[][] {{0}, {1}});
        DiscreteStateSpace discrete = ZeroOrderHold.discretize(a, b, periodSeconds);
        double t = periodSeconds;
        assertMatrixEquals(new DMatrixRMaj(new double[][] {{1, t}, {0, 1}}), discrete.ad(), 1e-14);
        assertMatrixEquals(new DMatrixRMaj(new double[][] {{t * t / 2}, {t}}), discrete.bd(), 1e-14);
        assertEquals(periodSeconds, discrete.samplePeriod());
    }

    @Test
    void firstOrderLag() {
        // source: ZOH of x' = a x + b u: Ad = e^(aT), Bd = (e^(aT) - 1) b / a.
        double a = -3.0;
        double b = 2.0;
        double t = 0.4;
        DiscreteStateSpace discrete = ZeroOrderHold.discretize(
                new DMatrixRMaj(new double[][] {{a}}), new DMatrixRMaj(new double[][] {{b}}), t);
        assertEquals(Math.exp(a * t), discrete.ad().get(0, 0), 1e-15);
        assertEquals(Math.expm1(a * t) * b / a, discrete.bd().get(0, 0), 1e-15);
    }

    @Test
    void harmonicOscillator() {
        // source: for A = [[0, w], [-w, 0]], e^(A s) is the rotation by w s, and its integral
        // over [0, T] is [[sin wT, 1 - cos wT], [-(1 - cos wT), sin wT]] / w; with B = [0, 1]'
        // this gives Bd = [(1 - cos wT) / w, sin wT / w]'.
        double w = 5.0; // rad/s
        double t = 0.37;
        DiscreteStateSpace discrete = ZeroOrderHold.discretize(
                new DMatrixRMaj(new double[][] {{0, w}, {-w, 0}}), new DMatrixRMaj(new double[][] {{0}, {1}}), t);
        double c = Math.cos(w * t);
        double s = Math.sin(w * t);
        assertMatrixEquals(new DMatrixRMaj(new double[][] {{c, s}, {-s, c}}), discrete.ad(), 1e-15);
        assertMatrixEquals(new DMatrixRMaj(new double[][] {{(1 - c) / w}, {s / w}}), discrete.bd(), 1e-15);
    }

    @Test
    void invertibleStateMatrixMatchesClosedForm() {
        // source: for invertible A, integral_0^T e^(A s) ds = A^-1 (e^(A T) - I), so
        // Bd = A^-1 (Ad - I) B (any digital control textbook).
        Random random = new Random(11L);
        int n = 3;
        int m = 2;
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        DMatrixRMaj b = new DMatrixRMaj(n, m);
        for (int i = 0; i < a.getNumElements(); i++) {
            a.data[i] = random.nextGaussian();
        }
        for (int i = 0; i < b.getNumElements(); i++) {
            b.data[i] = random.nextGaussian();
        }
        for (int i = 0; i < n; i++) {
            a.add(i, i, -3.0);
        }
        double t = 0.8;
        DiscreteStateSpace discrete = ZeroOrderHold.discretize(a, b, t);
        DMatrixRMaj at = a.copy();
        CommonOps_DDRM.scale(t, at);
        DMatrixRMaj expectedAd = MatrixExponential.of(at);
        DMatrixRMaj adMinusI = expectedAd.copy();
        CommonOps_DDRM.subtractEquals(adMinusI, CommonOps_DDRM.identity(n));
        DMatrixRMaj rhs = new DMatrixRMaj(n, m);
        CommonOps_DDRM.mult(adMinusI, b, rhs);
        DMatrixRMaj expectedBd = new DMatrixRMaj(n, m);
        CommonOps_DDRM.solve(a, rhs, expectedBd);
        assertMatrixEquals(expectedAd, discrete.ad(), 1e-14);
        assertMatrixEquals(expectedBd, discrete.bd(), 1e-13);
        assertEquals(2, discrete.inputCount());
        assertEquals(3, discrete.stateDimension());
    }

    @Test
    void twoHoldPeriodsComposeIntoOne() {
        // source: semigroup property of the exact solution: holding u over 2T equals two holds of
        // T, so Ad(2T) = Ad(T)^2 and Bd(2T) = Ad(T) Bd(T) + Bd(T).
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{0, 1}, {-400, -12}});
        DMatrixRMaj b = new DMatrixRMaj(new double[][] {{0}, {400}});
        double t = 0.013;
        DiscreteStateSpace one = ZeroOrderHold.discretize(a, b, t);
        DiscreteStateSpace two = ZeroOrderHold.discretize(a, b, 2 * t);
        DMatrixRMaj adSquared = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.mult(one.ad(), one.ad(), adSquared);
        DMatrixRMaj composedBd = new DMatrixRMaj(2, 1);
        CommonOps_DDRM.mult(one.ad(), one.bd(), composedBd);
        CommonOps_DDRM.addEquals(composedBd, one.bd());
        assertMatrixEquals(adSquared, two.ad(), 1e-14);
        assertMatrixEquals(composedBd, two.bd(), 1e-14);
    }

    @Test
    void recordCopiesItsMatrices() {
        DMatrixRMaj ad = new DMatrixRMaj(new double[][] {{1, 2}, {3, 4}});
        DMatrixRMaj bd = new DMatrixRMaj(new double[][] {{5}, {6}});
        DiscreteStateSpace discrete = new DiscreteStateSpace(ad, bd, 0.1);
        ad.set(0, 0, 99);
        bd.set(0, 0, 99);
        discrete.ad().set(1, 1, 99);
        discrete.bd().set(1, 0, 99);
        assertEquals(1.0, discrete.ad().get(0, 0));
        assertEquals(4.0, discrete.ad().get(1, 1));
        assertEquals(5.0, discrete.bd().get(0, 0));
        assertEquals(6.0, discrete.bd().get(1, 0));
    }

    @Test
    void rejectsBadArguments() {
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{0, 1}, {0, 0}});
        DMatrixRMaj b = new DMatrixRMaj(new double[][] {{0}, {1}});
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(null, b, 1));
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(a, null, 1));
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(a, b, 0.0));
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(a, b, -1.0));
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(a, b, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(a, b, Double.POSITIVE_INFINITY));
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(new DMatrixRMaj(2, 3), b, 1));
        assertThrows(IllegalArgumentException.class, () -> ZeroOrderHold.discretize(a, new DMatrixRMaj(3, 1), 1));
        assertThrows(
                IllegalArgumentException.class,
                () -> ZeroOrderHold.discretize(new DMatrixRMaj(32, 32), new DMatrixRMaj(32, 1), 1));
        assertThrows(
                IllegalArgumentException.class,
                () -> ZeroOrderHold.discretize(new DMatrixRMaj(new double[][] {{0, Double.NaN}, {0, 0}}), b, 1));
        assertThrows(IllegalArgumentException.class, () -> new DiscreteStateSpace(a, b, Double.NaN));
        assertThrows(
                IllegalArgumentException.class,
                () -> new DiscreteStateSpace(a, new DMatrixRMaj(new double[][] {{0}, {Double.NaN}}), 1));
        // e^(1000 * 1) overflows: reported, never returned as Infinity.
        assertThrows(
                IllegalArgumentException.class,
                () -> ZeroOrderHold.discretize(
                        new DMatrixRMaj(new double[][] {{1000}}), new DMatrixRMaj(new double[][] {{1}}), 1.0));
    }
}
