package com.loopwright.solver.norm;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.HInfinityNorm;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

class TwoStatePeakGainTest {

    private final TwoStatePeakGain peakGain = new TwoStatePeakGain();

    @Test
    void resonantPeakOfSecondOrderSystem() {
        // source: resonant peak of G = wn^2/(s^2 + 2 zeta wn s + wn^2), any control textbook:
        // Mr = 1/(2 zeta sqrt(1 - zeta^2)) at wr = wn sqrt(1 - 2 zeta^2) for zeta < 1/sqrt(2)
        double[][] cases = {{0.15, 1}, {0.05, 10}, {0.3, 0.2}, {0.5, 1000}, {0.7, 3}, {0.01, 2}, {0.001, 50}};
        for (double[] c : cases) {
            double zeta = c[0];
            double wn = c[1];
            HInfinityNorm norm =
                    peakGain.compute(HInfinityNormCalculatorTest.secondOrderA(zeta, wn), column(0, 1), row(wn * wn, 0));
            double expectedPeak = 1 / (2 * zeta * Math.sqrt(1 - zeta * zeta));
            assertEquals(expectedPeak, norm.value(), 1e-13 * expectedPeak, "zeta = " + zeta);
            assertEquals(wn * Math.sqrt(1 - 2 * zeta * zeta), norm.peakFrequencyRadPerSec(), 1e-12 * wn);
            assertEquals(0, norm.iterations());
        }
    }

    @Test
    void wellDampedSecondOrderSystemPeaksAtDc() {
        // source: for zeta >= 1/sqrt(2) the magnitude of wn^2/(s^2 + 2 zeta wn s + wn^2) falls monotonically
        // from its DC gain 1 (textbook), so the norm is 1 at w = 0
        for (double zeta : new double[] {1 / Math.sqrt(2), 0.75, 1, 2.5}) {
            HInfinityNorm norm =
                    peakGain.compute(HInfinityNormCalculatorTest.secondOrderA(zeta, 4), column(0, 1), row(16, 0));
            assertEquals(1.0, norm.value(), 1e-14);
            assertTrue(norm.peakFrequencyRadPerSec() < 1e-6, "peak at " + norm.peakFrequencyRadPerSec());
        }
    }

    @Test
    void bandPassPeaksAtTheNaturalFrequency() {
        // source: |jw/((jw)^2 + 2 zeta wn jw + wn^2)| = 1/(2 zeta wn) at w = wn, its maximum (textbook band-pass)
        double zeta = 0.3;
        double wn = 7;
        HInfinityNorm norm =
                peakGain.compute(HInfinityNormCalculatorTest.secondOrderA(zeta, wn), column(0, 1), row(0, 1));
        assertEquals(1 / (2 * zeta * wn), norm.value(), 1e-15);
        assertEquals(wn, norm.peakFrequencyRadPerSec(), 1e-12 * wn);
    }

    @Test
    void agreesWithTheHamiltonianIterationOnRandomLoops() {
        // independent route: the general calculator (Hamiltonian imaginary-axis eigenvalue tests), whose
        // result lies within 2e-10 below the norm; and a Hipparchus-only evaluation of sigma_max(G(jw)) at
        // the peak frequency found here
        HInfinityNormCalculator general = new HInfinityNormCalculator();
        Random random = new Random(20261202);
        for (int trial = 0; trial < 300; trial++) {
            DMatrixRMaj a = HInfinityNormCalculatorTest.randomHurwitz(2, random);
            DMatrixRMaj b = HInfinityNormCalculatorTest.gaussian(2, 1, random);
            DMatrixRMaj c = HInfinityNormCalculatorTest.gaussian(1 + random.nextInt(3), 2, random);
            HInfinityNorm exact = peakGain.compute(a, b, c);
            HInfinityNorm iterated = general.compute(a, b, c);
            assertEquals(iterated.value(), exact.value(), 1e-9 * exact.value(), "trial " + trial);
            // (no one-sided check here: A = T D T^-1 with entries far larger than its trace and determinant
            // carries rounding of about eps ||A||^2 / det A in the data themselves)
            double atPeak = new IndependentFrequencyResponse(a, b, c).maxSingularValue(exact.peakFrequencyRadPerSec());
            // jwI - A is nearly singular at a sharp resonance (condition ~ peak gain), so the reference
            // evaluation carries about cond * eps of rounding
            assertEquals(atPeak, exact.value(), 1e-9 * exact.value(), "trial " + trial);
        }
    }

    @Test
    void companionLoopsBoundTheHamiltonianLowerBoundFromAbove() {
        // the designer's loops: A = [[0, 1], [-c0, -c1]] (exact trace and determinant), b = [0, d]',
        // C = [[rho1, 0], [0, rho2], [-k1, -k2]]; the general calculator returns an attained gain below the norm
        // and a certified upper end within (1 + RELATIVE_TOLERANCE) above it, so the exact norm lies between
        HInfinityNormCalculator general = new HInfinityNormCalculator();
        Random random = new Random(11);
        for (int trial = 0; trial < 300; trial++) {
            double wn = Math.pow(10, -1 + 4 * random.nextDouble());
            double zeta = 0.05 + 1.5 * random.nextDouble();
            DMatrixRMaj a = HInfinityNormCalculatorTest.secondOrderA(zeta, wn);
            DMatrixRMaj b = column(0, Math.pow(10, -2 + 4 * random.nextDouble()));
            DMatrixRMaj c = new DMatrixRMaj(new double[][] {
                {random.nextDouble() * 10, 0},
                {0, random.nextDouble()},
                {-random.nextDouble() * wn, -random.nextDouble()}
            });
            HInfinityNorm exact = peakGain.compute(a, b, c);
            HInfinityNorm iterated = general.compute(a, b, c);
            assertTrue(exact.value() >= iterated.attainedGain() * (1 - 1e-14), "trial " + trial);
            assertTrue(exact.value() <= iterated.value() * (1 + 1e-14), "trial " + trial);
            assertTrue(
                    iterated.value() <= exact.value() * (1 + HInfinityNormCalculator.RELATIVE_TOLERANCE + 1e-14),
                    "trial " + trial);
        }
    }

    @Test
    void noSampledFrequencyExceedsThePeak() {
        // common practice: a dense log-spaced sweep (Hipparchus evaluation) never beats the exact peak
        Random random = new Random(7);
        for (int trial = 0; trial < 40; trial++) {
            DMatrixRMaj a = HInfinityNormCalculatorTest.randomHurwitz(2, random);
            DMatrixRMaj b = HInfinityNormCalculatorTest.gaussian(2, 1, random);
            DMatrixRMaj c = HInfinityNormCalculatorTest.gaussian(3, 2, random);
            double peak = peakGain.compute(a, b, c).value();
            IndependentFrequencyResponse response = new IndependentFrequencyResponse(a, b, c);
            for (int k = 0; k <= 400; k++) {
                double w = Math.pow(10, -3 + 7 * k / 400.0);
                assertTrue(response.maxSingularValue(w) <= peak * (1 + 1e-12), "trial " + trial + ", w = " + w);
            }
        }
    }

    @Test
    void repeatedAndRealPolesAreExact() {
        // source: 1/(s + 1)^2 has |G(jw)| = 1/(1 + w^2), largest at DC (= 1);
        // 1/(s + 1) - 1/(s + 100) = 99/((s + 1)(s + 100)) falls monotonically from its DC gain 0.99
        assertEquals(
                1.0,
                peakGain.compute(matrix(0, 1, -1, -2), column(0, 1), row(1, 0)).value(),
                1e-15);
        assertEquals(
                0.99,
                peakGain.compute(matrix(-1, 0, 0, -100), column(1, 1), row(1, -1))
                        .value(),
                1e-15);
    }

    @Test
    void zeroSystemAndUnstableOnes() {
        assertEquals(
                0.0,
                peakGain.compute(matrix(-1, 0, 0, -2), column(0, 0), row(1, 1)).value());
        assertThrows(
                UnstableSystemException.class, () -> peakGain.compute(matrix(0, 1, 4, -1), column(0, 1), row(1, 0)));
        assertThrows(
                UnstableSystemException.class, () -> peakGain.compute(matrix(0, 1, -4, 0), column(0, 1), row(1, 0)));
        assertThrows(
                UnstableSystemException.class, () -> peakGain.compute(matrix(0, 1, 0, -1), column(0, 1), row(1, 0)));
        assertThrows(
                IllegalArgumentException.class,
                () -> peakGain.compute(matrix(-1, 0, 0, -1), new DMatrixRMaj(2, 2), row(1, 0)));
        assertThrows(
                IllegalArgumentException.class,
                () -> peakGain.compute(matrix(-1, Double.NaN, 0, -1), column(0, 1), row(1, 0)));
    }

    private static DMatrixRMaj matrix(double a11, double a12, double a21, double a22) {
        return new DMatrixRMaj(new double[][] {{a11, a12}, {a21, a22}});
    }

    private static DMatrixRMaj column(double... values) {
        return new DMatrixRMaj(values.length, 1, true, values);
    }

    private static DMatrixRMaj row(double... values) {
        return new DMatrixRMaj(1, values.length, true, values);
    }
}
