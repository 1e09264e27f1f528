package com.loopwright.solver.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.plant.TwoStateModel;
import com.loopwright.solver.spec.TargetDynamics;
import java.math.BigDecimal;
import java.math.MathContext;
import org.ejml.data.DMatrixRMaj;
import org.junit.jupiter.api.Test;

/**
 * Issue 12, item 6: a state-space model whose controllability matrix [B2, A B2] has condition ~1e10. The outside
 * reference is BigDecimal arithmetic at 60 significant digits on the same double inputs: K_x by Ackermann's formula
 * K_x = e_2' C_x^-1 phi(A), phi(s) = s^2 + 2 zeta wn s + wn^2 (textbook pole placement), the tracked output c as the
 * second row of C_x^-1 scaled to a largest entry of 1 (TwoStateModel's definition), and the DC gain
 * -c (A - B2 K_x)^-1 B2 kr of the reported law.
 */
class IllConditionedStateSpaceTest {

    private static final MathContext DIGITS = new MathContext(60);

    /**
     * A = R diag(-100, -200) R' and B2 = R [1, 3e-9]' with R the rotation by 0.5 rad (rounded to doubles): B2 is
     * nearly the eigenvector of A for -100, so [B2, A B2] is nearly singular; B1 = B2 / 2.
     */
    private static final double[][] A = {
        {-122.98488470659302, 42.07354924039484}, {42.07354924039482, -177.015115293407}
    };

    private static final double[] B2 = {0.8775825604520961, 0.4794255412369507};
    private static final double[] B1 = {0.5 * B2[0], 0.5 * B2[1]};

    @Test
    void conditionIsStatedAndCallerGainAndDcGainMatchSixtyDigits() {
        TwoStateModel model = new TwoStateModel(A, B2, B1);
        TargetDynamics target = new TargetDynamics(0.8, 400);
        ClosedFormDesign design =
                new ClosedFormDesigner().design(model.canonical(), target, new GammaChoice.MarginOverMinimum(1.2));
        StateSpaceDesign view = CallerCoordinates.of(model, design);

        BigDecimal[][] cx = {{bd(B2[0]), ab2(0)}, {bd(B2[1]), ab2(1)}};
        BigDecimal det = cx[0][0].multiply(cx[1][1], DIGITS).subtract(cx[0][1].multiply(cx[1][0], DIGITS), DIGITS);
        // second row of C_x^-1 = [-cx10, cx00] / det
        BigDecimal[] row2 = {cx[1][0].negate().divide(det, DIGITS), cx[0][0].divide(det, DIGITS)};

        // condition number: sigma_max/sigma_min of the 2 x 2 C_x from its Frobenius norm and determinant:
        // sigma_max^2 + sigma_min^2 = ||C||_F^2, sigma_max sigma_min = |det| (standard identities)
        double frobeniusSquared = 0;
        for (BigDecimal[] r : cx) {
            for (BigDecimal v : r) {
                frobeniusSquared += v.doubleValue() * v.doubleValue();
            }
        }
        double d = Math.abs(det.doubleValue());
        double sMaxSquared = 0.5 * (frobeniusSquared + Math.sqrt(frobeniusSquared * frobeniusSquared - 4 * d * d));
        double expectedCondition = sMaxSquared / d;
        assertEquals(expectedCondition, model.controllabilityCondition(), 1e-6 * expectedCondition);
        assertTrue(model.controllabilityCondition() > 1e9, "condition " + model.controllabilityCondition());
        assertTrue(model.illConditioned());
        assertEquals(model.controllabilityCondition(), view.controllabilityCondition());

        // Ackermann: K_x = row2 * phi(A)
        BigDecimal alpha0 = bd(target.naturalFrequencyRadPerSec()).pow(2, DIGITS);
        BigDecimal alpha1 = bd(2).multiply(bd(target.dampingRatio()), DIGITS)
                .multiply(bd(target.naturalFrequencyRadPerSec()), DIGITS);
        BigDecimal[][] phi = new BigDecimal[2][2];
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                BigDecimal aa = BigDecimal.ZERO;
                for (int k = 0; k < 2; k++) {
                    aa = aa.add(bd(A[i][k]).multiply(bd(A[k][j]), DIGITS), DIGITS);
                }
                phi[i][j] = aa.add(alpha1.multiply(bd(A[i][j]), DIGITS), DIGITS)
                        .add(i == j ? alpha0 : BigDecimal.ZERO, DIGITS);
            }
        }
        BigDecimal[] kReference = new BigDecimal[2];
        for (int j = 0; j < 2; j++) {
            kReference[j] = row2[0].multiply(phi[0][j], DIGITS).add(row2[1].multiply(phi[1][j], DIGITS), DIGITS);
        }
        DMatrixRMaj gain = view.gain();
        double gainError = Math.max(
                relative(gain.get(0), kReference[0], kReference), relative(gain.get(1), kReference[1], kReference));

        BigDecimal scale = row2[0].abs().compareTo(row2[1].abs()) >= 0 ? row2[0] : row2[1];
        DMatrixRMaj c = view.trackedOutput();
        double outputError = Math.max(
                Math.abs(c.get(0) - row2[0].divide(scale, DIGITS).doubleValue()),
                Math.abs(c.get(1) - row2[1].divide(scale, DIGITS).doubleValue()));

        // DC gain of the reported law u = kr r - K_x x, y = c x, evaluated at 60 digits
        BigDecimal dcGain = dcGain(gain, c, view.referenceGain());
        double dcError = dcGain.subtract(BigDecimal.ONE).abs().doubleValue();
        System.out.printf(
                "ill-conditioned state space: cond %.3e, K_x relative error %.2e, c error %.2e,"
                        + " |DC gain - 1| %.2e%n",
                model.controllabilityCondition(), gainError, outputError, dcError);
        // the stated bound: up to log10(cond) digits lost, i.e. relative error <= a few cond * unit roundoff
        double statedBound = 4 * model.controllabilityCondition() * 0x1p-53;
        assertTrue(gainError < statedBound, "K_x relative error " + gainError + " above " + statedBound);
        assertTrue(outputError < statedBound, "c error " + outputError);
        // the reference gain comes from the caller's own closed loop: the stated law tracks r to ~1e-9 here;
        // through the canonical form (K_z T^-1 with an explicit inverse, canonical kr) it was off by 4.2e-8
        assertTrue(dcError < 1e-8, "DC gain off by " + dcError);
    }

    @Test
    void wellConditionedModelCarriesNoNote() {
        TwoStateModel model =
                new TwoStateModel(new double[][] {{0, 50}, {0, -2}}, new double[] {0, 3}, new double[] {0, 1});
        assertFalse(model.illConditioned());
        assertTrue(model.controllabilityCondition() < 100);
    }

    /** -c (A - B2 K)^-1 B2 kr by the 2 x 2 adjugate at 60 digits. */
    private static BigDecimal dcGain(DMatrixRMaj k, DMatrixRMaj c, double kr) {
        BigDecimal[][] m = new BigDecimal[2][2];
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                m[i][j] = bd(A[i][j]).subtract(bd(B2[i]).multiply(bd(k.get(j)), DIGITS), DIGITS);
            }
        }
        BigDecimal det = m[0][0].multiply(m[1][1], DIGITS).subtract(m[0][1].multiply(m[1][0], DIGITS), DIGITS);
        // x = m^-1 B2 = adj(m) B2 / det
        BigDecimal x0 = m[1][1].multiply(bd(B2[0]), DIGITS)
                .subtract(m[0][1].multiply(bd(B2[1]), DIGITS), DIGITS)
                .divide(det, DIGITS);
        BigDecimal x1 = m[0][0].multiply(bd(B2[1]), DIGITS)
                .subtract(m[1][0].multiply(bd(B2[0]), DIGITS), DIGITS)
                .divide(det, DIGITS);
        BigDecimal cx = bd(c.get(0)).multiply(x0, DIGITS).add(bd(c.get(1)).multiply(x1, DIGITS), DIGITS);
        return cx.negate().multiply(bd(kr), DIGITS);
    }

    private static BigDecimal ab2(int i) {
        return bd(A[i][0]).multiply(bd(B2[0]), DIGITS).add(bd(A[i][1]).multiply(bd(B2[1]), DIGITS), DIGITS);
    }

    private static double relative(double actual, BigDecimal expected, BigDecimal[] all) {
        double norm = Math.hypot(all[0].doubleValue(), all[1].doubleValue());
        return Math.abs(actual - expected.doubleValue()) / norm;
    }

    private static BigDecimal bd(double v) {
        return new BigDecimal(v);
    }
}
