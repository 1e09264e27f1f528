package com.loopwright.solver.norm;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.HInfinityNorm;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

class HInfinityNormCalculatorTest {

    private final HInfinityNormCalculator calculator = new HInfinityNormCalculator();

    @Test
    void resonantPeakOfSecondOrderSystem() {
        // source: resonant peak of a second-order system, any control textbook:
        // G = wn^2/(s^2 + 2 zeta wn s + wn^2), zeta < 1/sqrt(2):
        // Mr = 1/(2 zeta sqrt(1 - zeta^2)) at wr = wn sqrt(1 - 2 zeta^2)
        double[][] cases = {
            {0.15, 1}, {0.05, 10}, {0.3, 0.2}, {0.5, 1000}, {0.7, 3}, {0.01, 2}, {0.4, 1e-2}, {0.001, 50}
        };
        for (double[] c : cases) {
            double zeta = c[0];
            double wn = c[1];
            HInfinityNorm norm = calculator.compute(secondOrderA(zeta, wn), column(0, 1), row(wn * wn, 0));
            double expectedPeak = 1 / (2 * zeta * Math.sqrt(1 - zeta * zeta));
            double expectedFrequency = wn * Math.sqrt(1 - 2 * zeta * zeta);
            assertEquals(expectedPeak, norm.value(), 1e-8 * expectedPeak, "zeta = " + zeta + ", wn = " + wn);
            assertEquals(
                    expectedFrequency, norm.peakFrequencyRadPerSec(), 1e-5 * wn, "zeta = " + zeta + ", wn = " + wn);
            assertTrue(norm.iterations() >= 1 && norm.iterations() <= 100);
        }
        // wn = 1, zeta = 0.15: Mr = 3.3715..., wr = 0.97724...
        HInfinityNorm example = calculator.compute(secondOrderA(0.15, 1), column(0, 1), row(1, 0));
        assertEquals(3.3715, example.value(), 1e-4);
        assertEquals(0.9772, example.peakFrequencyRadPerSec(), 1e-4);
    }

    @Test
    void wellDampedSecondOrderSystemPeaksAtDc() {
        // source: |G(jw)|^2 = wn^4/((wn^2 - w^2)^2 + 4 zeta^2 wn^2 w^2) decreases monotonically in w
        // when zeta >= 1/sqrt(2), so the norm is the DC gain G(0) = 1, attained at w = 0
        double[][] cases = {{1 / Math.sqrt(2), 1}, {0.75, 4}, {1, 0.5}, {2.5, 100}, {0.72, 1e-3}};
        for (double[] c : cases) {
            double zeta = c[0];
            double wn = c[1];
            HInfinityNorm norm = calculator.compute(secondOrderA(zeta, wn), column(0, 1), row(wn * wn, 0));
            assertBrackets(1.0, norm, 1e-12, "zeta = " + zeta);
            assertTrue(norm.peakFrequencyRadPerSec() < 1e-3 * wn, "peak at " + norm.peakFrequencyRadPerSec());
        }
    }

    /**
     * The certificate brackets an exactly known norm: exact (1 - rounding) <= value <= exact (1 + tolerance +
     * rounding), and the gain attained at the reported frequency is not above the exact norm.
     */
    static void assertBrackets(double exact, HInfinityNorm norm, double rounding, String message) {
        assertTrue(norm.value() >= exact * (1 - rounding), message + ": value " + norm.value() + " below " + exact);
        assertTrue(
                norm.value() <= exact * (1 + HInfinityNormCalculator.RELATIVE_TOLERANCE + rounding),
                message + ": value " + norm.value() + " above " + exact + " beyond the stated tolerance");
        assertTrue(norm.attainedGain() <= exact * (1 + rounding), message + ": attained " + norm.attainedGain());
        assertEquals(exact, norm.attainedGain(), 1e-9 * exact, message);
    }

    @Test
    void firstOrderSystems() {
        // source: |cb/(jw + a)| = |cb|/sqrt(w^2 + a^2) is largest at w = 0: ||cb/(s + a)||inf = |cb|/a
        double[][] cases = {{1, 1, 1}, {0.01, 1, 1}, {250, 1, 1}, {3, -2, 0.5}, {1e-3, 1e3, 1e-3}};
        for (double[] c : cases) {
            double a = c[0];
            double gain = Math.abs(c[1] * c[2]);
            HInfinityNorm norm = calculator.compute(scalar(-a), scalar(c[1]), scalar(c[2]));
            assertBrackets(gain / a, norm, 1e-12, "a = " + a);
            assertEquals(0.0, norm.peakFrequencyRadPerSec(), 1e-6 * a);
        }
    }

    @Test
    void diagonalMimoSystemTakesLargestChannelAndIsUnitarilyInvariant() {
        // channels: 3/(s + 2) (norm 1.5 at w = 0), resonant zeta = 0.1 at wn = 5 (norm 1/(2*0.1*sqrt(0.99))
        // at 5 sqrt(0.98)), and 1/(s + 1) (norm 1). source: for G = diag(g_i), sigma_max(G(jw)) = max_i |g_i(jw)|
        DMatrixRMaj a = new DMatrixRMaj(4, 4);
        a.set(0, 0, -2);
        CommonOps_DDRM.insert(secondOrderA(0.1, 5), a, 1, 1);
        a.set(3, 3, -1);
        DMatrixRMaj b = new DMatrixRMaj(4, 3);
        b.set(0, 0, 3);
        b.set(2, 1, 1);
        b.set(3, 2, 1);
        DMatrixRMaj c = new DMatrixRMaj(3, 4);
        c.set(0, 0, 1);
        c.set(1, 1, 25);
        c.set(2, 3, 1);
        double resonant = 1 / (2 * 0.1 * Math.sqrt(1 - 0.01));
        double resonantFrequency = 5 * Math.sqrt(1 - 2 * 0.01);
        HInfinityNorm norm = calculator.compute(a, b, c);
        assertEquals(resonant, norm.value(), 1e-8 * resonant);
        assertEquals(resonantFrequency, norm.peakFrequencyRadPerSec(), 1e-5 * resonantFrequency);

        // source: singular values are invariant under unitary transformations, so U G V' with
        // orthogonal U (3x3) and V (3x3) has the same norm; implemented as C <- U C, B <- B V'.
        DMatrixRMaj u = rotation(0.7, 1.9, -0.4);
        DMatrixRMaj v = rotation(-1.2, 0.3, 2.2);
        DMatrixRMaj rotatedC = new DMatrixRMaj(3, 4);
        CommonOps_DDRM.mult(u, c, rotatedC);
        DMatrixRMaj rotatedB = new DMatrixRMaj(4, 3);
        CommonOps_DDRM.multTransB(b, v, rotatedB);
        HInfinityNorm rotated = calculator.compute(a, rotatedB, rotatedC);
        assertEquals(resonant, rotated.value(), 1e-8 * resonant);
        assertEquals(resonantFrequency, rotated.peakFrequencyRadPerSec(), 1e-5 * resonantFrequency);

        // dropping the resonant channel leaves the first-order channel 3/(s + 2) on top: 1.5 at w = 0
        c.set(1, 1, 0);
        HInfinityNorm withoutResonance = calculator.compute(a, b, c);
        assertBrackets(1.5, withoutResonance, 1e-12, "first-order channel");
        assertEquals(0.0, withoutResonance.peakFrequencyRadPerSec(), 1e-6);
    }

    @Test
    void randomStableSystemsAgreeWithIndependentFrequencySweep() {
        // source: ||G||inf = sup_w sigma_max(G(jw)); any sampled value is a lower bound, and a grid
        // refined around the peak approaches the supremum. Sweeps use Hipparchus, not the code under test.
        Random random = new Random(99L);
        double worstGap = 0.0;
        double worstExcess = Double.NEGATIVE_INFINITY;
        int maxIterations = 0;
        for (int trial = 0; trial < 60; trial++) {
            int n = 2 + random.nextInt(7);
            int m = 1 + random.nextInt(3);
            int p = 1 + random.nextInt(3);
            DMatrixRMaj a = randomHurwitz(n, random);
            DMatrixRMaj b = gaussian(n, m, random);
            DMatrixRMaj c = gaussian(p, n, random);
            HInfinityNorm norm = calculator.compute(a, b, c);
            IndependentFrequencyResponse sweep = new IndependentFrequencyResponse(a, b, c);

            double gridMax = sweep.maxSingularValue(0.0);
            for (int i = 0; i <= 1000; i++) {
                gridMax = Math.max(gridMax, sweep.maxSingularValue(Math.pow(10, -3 + 6.0 * i / 1000)));
            }
            double refinedMax = refineAround(sweep, norm.peakFrequencyRadPerSec());
            double bound = norm.value() * (1 + 1e-9);
            assertTrue(gridMax <= bound, "grid value " + gridMax + " exceeds norm " + norm.value());
            assertTrue(refinedMax <= bound, "refined value " + refinedMax + " exceeds norm " + norm.value());
            double gap = (norm.value() - refinedMax) / norm.value();
            assertTrue(gap < 1e-6, "refined sweep " + refinedMax + " vs norm " + norm.value());
            assertEquals(
                    norm.attainedGain(), sweep.maxSingularValue(norm.peakFrequencyRadPerSec()), 1e-12 * norm.value());
            assertTrue(
                    norm.value() <= refinedMax * (1 + HInfinityNormCalculator.RELATIVE_TOLERANCE + 1e-12),
                    "certified upper end " + norm.value() + " vs refined sweep " + refinedMax);
            worstGap = Math.max(worstGap, gap);
            worstExcess = Math.max(worstExcess, (refinedMax - norm.value()) / norm.value());
            maxIterations = Math.max(maxIterations, norm.iterations());
        }
        System.out.printf(
                "norm vs sweep: worst (norm - refined sweep)/norm %.3e, worst (refined sweep - norm)/norm %.3e, max iterations %d%n",
                worstGap, worstExcess, maxIterations);
    }

    @Test
    void unstableOrMarginallyStableSystemsThrow() {
        DMatrixRMaj b = column(0, 1);
        DMatrixRMaj c = row(1, 0);
        // eigenvalues 0.1 +- j: unstable
        UnstableSystemException e = assertThrows(
                UnstableSystemException.class,
                () -> calculator.compute(new DMatrixRMaj(new double[][] {{0.1, 1}, {-1, 0.1}}), b, c));
        assertFalse(e.getMessage().isBlank());
        // undamped oscillator, eigenvalues +- j
        assertThrows(UnstableSystemException.class, () -> calculator.compute(secondOrderA(0, 1), b, c));
        // integrator
        assertThrows(UnstableSystemException.class, () -> calculator.compute(scalar(0), scalar(1), scalar(1)));
        assertThrows(UnstableSystemException.class, () -> calculator.compute(scalar(2), scalar(1), scalar(1)));
    }

    @Test
    void zeroTransferMatrixHasZeroNorm() {
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{-1, 0}, {0, -2}});
        HInfinityNorm noOutput = calculator.compute(a, column(1, 1), row(0, 0));
        assertEquals(0.0, noOutput.value());
        // source: C (sI - A)^-1 B = 0 when the input only reaches a state the output does not see
        HInfinityNorm decoupled = calculator.compute(a, column(1, 0), row(0, 1));
        assertEquals(0.0, decoupled.value());
        assertEquals(0.0, decoupled.peakFrequencyRadPerSec());
    }

    @Test
    void handlesLargestSupportedDimension() {
        Random random = new Random(32L);
        DMatrixRMaj a = randomHurwitz(32, random);
        DMatrixRMaj b = gaussian(32, 2, random);
        DMatrixRMaj c = gaussian(2, 32, random);
        HInfinityNorm norm = calculator.compute(a, b, c);
        IndependentFrequencyResponse sweep = new IndependentFrequencyResponse(a, b, c);
        double refined = refineAround(sweep, norm.peakFrequencyRadPerSec());
        assertTrue(refined <= norm.value() * (1 + 1e-9) && refined >= norm.value() * (1 - 1e-6));
    }

    @Test
    void rejectsInvalidInput() {
        DMatrixRMaj a = secondOrderA(0.5, 1);
        assertThrows(
                IllegalArgumentException.class,
                () -> calculator.compute(new DMatrixRMaj(2, 3), column(0, 1), row(1, 0)));
        assertThrows(IllegalArgumentException.class, () -> calculator.compute(a, new DMatrixRMaj(3, 1), row(1, 0)));
        assertThrows(IllegalArgumentException.class, () -> calculator.compute(a, new DMatrixRMaj(2, 0), row(1, 0)));
        assertThrows(IllegalArgumentException.class, () -> calculator.compute(a, column(0, 1), new DMatrixRMaj(1, 3)));
        assertThrows(IllegalArgumentException.class, () -> calculator.compute(a, column(0, Double.NaN), row(1, 0)));
        DMatrixRMaj big = CommonOps_DDRM.identity(33);
        CommonOps_DDRM.scale(-1, big);
        assertThrows(
                IllegalArgumentException.class,
                () -> calculator.compute(big, new DMatrixRMaj(33, 1), new DMatrixRMaj(1, 33)));
        assertThrows(NullPointerException.class, () -> calculator.compute(a, null, row(1, 0)));
    }

    /** Zooms a 201-point grid in five stages around {@code center}, returning the largest value seen. */
    static double refineAround(IndependentFrequencyResponse sweep, double center) {
        double best = sweep.maxSingularValue(center);
        double bestFrequency = center;
        double halfWidth = 0.05 * Math.max(center, 1e-2);
        for (int stage = 0; stage < 5; stage++) {
            double low = Math.max(0.0, bestFrequency - halfWidth);
            double high = bestFrequency + halfWidth;
            for (int i = 0; i <= 200; i++) {
                double w = low + (high - low) * i / 200;
                double value = sweep.maxSingularValue(w);
                if (value > best) {
                    best = value;
                    bestFrequency = w;
                }
            }
            halfWidth /= 20;
        }
        return best;
    }

    /** A = T D T^-1 with D block diagonal holding random stable real poles and complex pairs. */
    static DMatrixRMaj randomHurwitz(int n, Random random) {
        DMatrixRMaj d = new DMatrixRMaj(n, n);
        int i = 0;
        while (i < n) {
            double decay = 0.02 * Math.pow(250, random.nextDouble());
            if (i + 1 < n && random.nextBoolean()) {
                double oscillation = 0.1 + 20 * random.nextDouble();
                d.set(i, i, -decay);
                d.set(i + 1, i + 1, -decay);
                d.set(i, i + 1, oscillation);
                d.set(i + 1, i, -oscillation);
                i += 2;
            } else {
                d.set(i, i, -decay);
                i++;
            }
        }
        DMatrixRMaj t = gaussian(n, n, random);
        for (int k = 0; k < n; k++) {
            t.add(k, k, 2.0);
        }
        DMatrixRMaj tInverse = t.copy();
        assertTrue(CommonOps_DDRM.invert(tInverse));
        DMatrixRMaj td = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(t, d, td);
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        CommonOps_DDRM.mult(td, tInverse, a);
        return a;
    }

    static DMatrixRMaj gaussian(int rows, int cols, Random random) {
        DMatrixRMaj m = new DMatrixRMaj(rows, cols);
        for (int i = 0; i < m.getNumElements(); i++) {
            m.data[i] = random.nextGaussian();
        }
        return m;
    }

    static DMatrixRMaj secondOrderA(double zeta, double wn) {
        return new DMatrixRMaj(new double[][] {{0, 1}, {-wn * wn, -2 * zeta * wn}});
    }

    private static DMatrixRMaj rotation(double x, double y, double z) {
        DMatrixRMaj rx = new DMatrixRMaj(
                new double[][] {{1, 0, 0}, {0, Math.cos(x), -Math.sin(x)}, {0, Math.sin(x), Math.cos(x)}});
        DMatrixRMaj ry = new DMatrixRMaj(
                new double[][] {{Math.cos(y), 0, Math.sin(y)}, {0, 1, 0}, {-Math.sin(y), 0, Math.cos(y)}});
        DMatrixRMaj rz = new DMatrixRMaj(
                new double[][] {{Math.cos(z), -Math.sin(z), 0}, {Math.sin(z), Math.cos(z), 0}, {0, 0, 1}});
        DMatrixRMaj rxy = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.mult(rx, ry, rxy);
        DMatrixRMaj r = new DMatrixRMaj(3, 3);
        CommonOps_DDRM.mult(rxy, rz, r);
        return r;
    }

    private static DMatrixRMaj scalar(double value) {
        return new DMatrixRMaj(new double[][] {{value}});
    }

    private static DMatrixRMaj column(double... values) {
        return new DMatrixRMaj(values.length, 1, true, values);
    }

    private static DMatrixRMaj row(double... values) {
        return new DMatrixRMaj(1, values.length, true, values);
    }
}
