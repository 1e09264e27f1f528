package com.loopwright.solver.norm;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.HInfinityNorm;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

/** Regressions of the certified H-infinity norm on badly scaled closed loops. */
class HInfinityNormRegressionTest {

    private final HInfinityNormCalculator calculator = new HInfinityNormCalculator();

    /**
     * Issue 12, item 1: the order-5 design of POST /v1/designs/high-order for denominator [3286.5795497977865,
     * 2443.8582808398724, 1093.8567775813508, 164.76062175845746, 24.903359880407102], b 0.36536984243058584,
     * numerator [1, -0.010096282201076452, 0, 0, 0], disturbance [0, 0, 0, 0, 988.6561066119183], settling
     * 0.41617516156597156 s, overshoot 2.3321485160205992 %, matchSpecs. Its gain K and weights rho below are the
     * response's; the closed loop is A - b e_n K, B1 = disturbance, z = [rho_i z_i; -K z]. The norm was reported
     * as 3971.748 at 44.94 rad/s (not a local maximum): the unbalanced Hamiltonian (||M||_F ~ 1e11) had
     * eigenvalues wrong by more than the imaginary-axis band. Outside reference: the 40-digit mpmath peak,
     * 3973.374 at 46.71 rad/s, and here a dense Hipparchus grid refined by Brent ({@link DenseGridPeak}).
     */
    @Test
    void companionLoopWithTenDecadesOfCoefficientsIsNotUnderestimated() {
        double[] denominator = {
            3286.5795497977865, 2443.8582808398724, 1093.8567775813508, 164.76062175845746, 24.903359880407102
        };
        double b = 0.36536984243058584;
        double[] k = {
            8.53062239383797E7, 1.3034084009849595E7, 902605.7905172684, 29690.134300739497, 399.94475534320117
        };
        double[] rho = {7.50816215481988E7, 3457512.964125883, 298789.5816734896, 9809.467403276947, 125.99626990164073
        };
        int n = 5;
        DMatrixRMaj a = new DMatrixRMaj(n, n);
        DMatrixRMaj c = new DMatrixRMaj(n + 1, n);
        for (int i = 0; i + 1 < n; i++) {
            a.set(i, i + 1, 1);
        }
        for (int j = 0; j < n; j++) {
            a.set(n - 1, j, -denominator[j] - b * k[j]);
            c.set(j, j, rho[j]);
            c.set(n, j, -k[j]);
        }
        DMatrixRMaj disturbance = new DMatrixRMaj(n, 1);
        disturbance.set(n - 1, 0, 988.6561066119183);

        HInfinityNorm norm = calculator.compute(a, disturbance, c);
        DenseGridPeak.Peak reference = DenseGridPeak.of(a, disturbance, c, 1e-2, 1e5, 4000);

        // the mpmath values, to the digits it states
        assertEquals(3973.374, norm.value(), 0.0005);
        assertEquals(46.71, norm.peakFrequencyRadPerSec(), 0.005);
        assertCertifiedAgainst(reference, norm);
        IndependentFrequencyResponse response = new IndependentFrequencyResponse(a, disturbance, c);
        assertLocalMaximum(response, norm);
    }

    /** The reference peak lies in [attainedGain, value] up to rounding; value within the stated tolerance. */
    static void assertCertifiedAgainst(DenseGridPeak.Peak reference, HInfinityNorm norm) {
        double rounding = 1e-12;
        assertTrue(
                norm.value() >= reference.gain() * (1 - rounding),
                "norm " + norm.value() + " below the refined grid peak " + reference.gain());
        assertTrue(
                norm.value() >= reference.gridMaximum() * (1 - rounding),
                "norm " + norm.value() + " below the grid maximum " + reference.gridMaximum());
        assertTrue(
                norm.value() <= reference.gain() * (1 + HInfinityNormCalculator.RELATIVE_TOLERANCE + rounding),
                "norm " + norm.value() + " more than the tolerance above the refined grid peak " + reference.gain());
        assertTrue(norm.attainedGain() <= norm.value());
    }

    /** sigma_max at the reported frequency is the attained gain and no larger a relative step either side. */
    static void assertLocalMaximum(IndependentFrequencyResponse response, HInfinityNorm norm) {
        double w = norm.peakFrequencyRadPerSec();
        double atPeak = response.maxSingularValue(w);
        assertEquals(norm.attainedGain(), atPeak, 1e-12 * atPeak);
        double step = w == 0.0 ? 1e-6 : 1e-5 * w;
        assertTrue(response.maxSingularValue(w + step) <= atPeak * (1 + 1e-13), "rises above " + w);
        assertTrue(w == 0.0 || response.maxSingularValue(w - step) <= atPeak * (1 + 1e-13), "rises below " + w);
    }
}
