package com.loopwright.solver.norm;

import com.loopwright.solver.design.HInfinityNorm;
import com.loopwright.solver.linalg.TwoByTwoSpectrum;
import java.util.Objects;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.NormOps_DDRM;

/**
 * Exact H-infinity norm of a two-state, single-input system G(s) = C (sI - A)^-1 b (A Hurwitz, 2 x 2;
 * b 2 x 1; C p x 2), without iteration.
 *
 * <p>Math: adj(sI - A) b = u0 + s b with u0 = [a12 b2 - a22 b1, a21 b1 - a11 b2]', and
 * det(sI - A) = s^2 + tau s + delta with tau = -tr A, delta = det A. With v0 = C u0, v1 = C b and t = w^2,
 * G(jw) is the vector (v0 + jw v1) / det(jwI - A), whose only singular value is its length:
 * <pre>
 *   sigma_max(G(jw))^2 = f(t) = (alpha + beta t) / ((delta - t)^2 + tau^2 t),   alpha = |v0|^2, beta = |v1|^2.
 * </pre>
 * f'(t) has the sign of kappa - beta t^2 - 2 alpha t with kappa = beta delta^2 - alpha (tau^2 - 2 delta), so
 * for kappa &gt; 0 the peak is at the single positive root t* = kappa / (alpha + sqrt(alpha^2 + beta kappa))
 * (the cancellation-free form of the quadratic formula), and for kappa &lt;= 0 f falls from its DC value
 * f(0) = alpha / delta^2. The denominator is a sum of non-negative terms for a Hurwitz A (delta, tau &gt; 0), so
 * the peak is evaluated without cancellation.
 *
 * <p>This route uses only the loop's matrices (no Riccati solution) and agrees with the general
 * {@link HInfinityNormCalculator} to its tolerance. Stateless and thread-safe.
 */
public final class TwoStatePeakGain {

    /**
     * @param a 2 x 2 Hurwitz state matrix
     * @param b 2 x 1 input vector
     * @param c p x 2 output matrix, p &gt;= 1
     * @return the norm and its peak frequency, with {@code iterations} 0 (no eigenvalue test is needed)
     * @throws IllegalArgumentException for wrong shapes or non-finite entries
     * @throws UnstableSystemException if A is not Hurwitz (the general calculator's margin)
     * @throws NormComputationException if the peak overflows double precision
     */
    public HInfinityNorm compute(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        validate(a, b, c);
        double a11 = a.get(0, 0);
        double a12 = a.get(0, 1);
        double a21 = a.get(1, 0);
        double a22 = a.get(1, 1);
        double tau = -(a11 + a22);
        double delta = a11 * a22 - a12 * a21;
        requireHurwitz(a);

        double b1 = b.get(0, 0);
        double b2 = b.get(1, 0);
        double u01 = a12 * b2 - a22 * b1;
        double u02 = a21 * b1 - a11 * b2;
        double alpha = 0.0;
        double beta = 0.0;
        for (int i = 0; i < c.numRows; i++) {
            double v0 = c.get(i, 0) * u01 + c.get(i, 1) * u02;
            double v1 = c.get(i, 0) * b1 + c.get(i, 1) * b2;
            alpha += v0 * v0;
            beta += v1 * v1;
        }
        if (alpha == 0.0 && beta == 0.0) {
            return new HInfinityNorm(0.0, 0.0, 0);
        }
        double kappa = beta * delta * delta - alpha * (tau * tau - 2.0 * delta);
        double peakSquaredFrequency = kappa > 0.0 ? kappa / (alpha + Math.sqrt(alpha * alpha + beta * kappa)) : 0.0;
        double gainSquared = squaredGain(alpha, beta, tau, delta, peakSquaredFrequency);
        double gain = Math.sqrt(gainSquared);
        double frequency = Math.sqrt(peakSquaredFrequency);
        if (!Double.isFinite(gain) || !Double.isFinite(frequency)) {
            throw new NormComputationException("the peak gain of the two-state loop overflows double precision"
                    + " (alpha = " + alpha + ", beta = " + beta + ", det A = " + delta + ")");
        }
        return new HInfinityNorm(gain, frequency, 0);
    }

    /** f(t) = (alpha + beta t) / ((delta - t)^2 + tau^2 t). */
    static double squaredGain(double alpha, double beta, double tau, double delta, double t) {
        double offResonance = delta - t;
        return (alpha + beta * t) / (offResonance * offResonance + tau * tau * t);
    }

    private static void requireHurwitz(DMatrixRMaj a) {
        HInfinityNormCalculator.requireHurwitz(TwoByTwoSpectrum.of(a).abscissa(), NormOps_DDRM.normF(a));
    }

    private static void validate(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        Objects.requireNonNull(a, "A");
        Objects.requireNonNull(b, "B");
        Objects.requireNonNull(c, "C");
        if (a.numRows != 2 || a.numCols != 2) {
            throw new IllegalArgumentException("A must be 2x2, got " + a.numRows + "x" + a.numCols);
        }
        if (b.numRows != 2 || b.numCols != 1) {
            throw new IllegalArgumentException("b must be 2x1, got " + b.numRows + "x" + b.numCols);
        }
        if (c.numCols != 2 || c.numRows == 0) {
            throw new IllegalArgumentException("C must be px2 with p >= 1, got " + c.numRows + "x" + c.numCols);
        }
        HInfinityNormCalculator.requireFinite(a, "A");
        HInfinityNormCalculator.requireFinite(b, "b");
        HInfinityNormCalculator.requireFinite(c, "C");
    }
}
