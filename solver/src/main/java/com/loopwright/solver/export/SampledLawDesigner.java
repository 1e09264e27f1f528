package com.loopwright.solver.export;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.SampledLaw;
import com.loopwright.solver.numeric.SafeRounding;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import org.ejml.data.DMatrixRMaj;

/**
 * Emulates a continuous design at a sample period and checks the sampled loop: with the plant sampled exactly
 * under zero-order hold, x[k+1] = Ad x[k] + Bd u[k], and u[k] = -K x[k] + kr r, the unclamped loop matrix is
 * Ad - Bd K. Its eigenvalues of the 2 x 2 matrix M solve z^2 - tr(M) z + det(M) = 0.
 */
public final class SampledLawDesigner {

    /** Shortest accepted sample period [s] (10 kHz is beyond most drive position loops). */
    public static final double MIN_SAMPLE_PERIOD = 1e-5;
    /** Longest accepted sample period [s]. */
    public static final double MAX_SAMPLE_PERIOD = 10;
    /**
     * Emulation keeps the continuous behaviour only when the period is short against 1/wn; above this wn T
     * the sampled loop is rejected even if stable (common practice: sample 20 to 30 times per rise time).
     */
    public static final double MAX_PERIOD_PER_TIME_CONSTANT = 0.5;
    /** Significant digits of the advised longest period (rounded down, so the advice is always accepted). */
    static final int ADVICE_DIGITS = 4;

    /**
     * @param commandMin the lowest command the actuator takes [u units]
     * @param commandMax the highest command the actuator takes [u units]
     * @throws SampledLawException when the period or limits are out of range, or the sampled loop is not stable
     *     with margin (wn T above {@value #MAX_PERIOD_PER_TIME_CONSTANT} or spectral radius &gt;= 1)
     */
    public SampledLaw emulate(ClosedFormDesign design, double samplePeriod, double commandMin, double commandMax) {
        if (!(samplePeriod >= MIN_SAMPLE_PERIOD && samplePeriod <= MAX_SAMPLE_PERIOD)) {
            throw new SampledLawException(
                    "the sample period must lie in [" + MIN_SAMPLE_PERIOD + ", " + MAX_SAMPLE_PERIOD + "] s", true);
        }
        if (!Double.isFinite(commandMin) || !Double.isFinite(commandMax) || !(commandMin < commandMax)) {
            throw new SampledLawException("the command limits must be finite with the lowest below the highest", false);
        }
        double wn = design.target().naturalFrequencyRadPerSec();
        double periodPerTimeConstant = wn * samplePeriod;
        // compared as T > 0.5 / wn, the same double the advice below is rounded down from
        double longestPeriod = MAX_PERIOD_PER_TIME_CONSTANT / wn;
        if (samplePeriod > longestPeriod) {
            throw new SampledLawException(
                    String.format(
                            java.util.Locale.ROOT,
                            "the sample period %.6g s is too long for a loop with natural frequency %.6g rad/s: wn T = %.6g"
                                    + " exceeds %.2g; use a period of at most %." + ADVICE_DIGITS + "g s",
                            samplePeriod,
                            wn,
                            periodPerTimeConstant,
                            MAX_PERIOD_PER_TIME_CONSTANT,
                            SafeRounding.atMost(longestPeriod, ADVICE_DIGITS)),
                    true);
        }
        double k1 = design.positionGain();
        double k2 = design.velocityGain();
        DiscreteStateSpace sampled = sampledPlant(design.plant(), samplePeriod);
        DMatrixRMaj ad = sampled.ad();
        DMatrixRMaj bd = sampled.bd();
        double m11 = ad.get(0, 0) - bd.get(0, 0) * k1;
        double m12 = ad.get(0, 1) - bd.get(0, 0) * k2;
        double m21 = ad.get(1, 0) - bd.get(1, 0) * k1;
        double m22 = ad.get(1, 1) - bd.get(1, 0) * k2;
        double radius = spectralRadius(m11, m12, m21, m22);
        if (!(radius < 1)) {
            throw new SampledLawException(
                    "the sampled loop is unstable at this period (spectral radius " + radius
                            + "); shorten the sample period",
                    true);
        }
        return new SampledLaw(
                samplePeriod, k1, k2, design.referenceGain(), commandMin, commandMax, radius, periodPerTimeConstant);
    }

    /** The canonical plant sampled exactly under zero-order hold. */
    public static DiscreteStateSpace sampledPlant(CanonicalPlant plant, double samplePeriod) {
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{0, 1}, {-plant.a0(), -plant.a1()}});
        DMatrixRMaj b = new DMatrixRMaj(new double[][] {{0}, {plant.b()}});
        return ZeroOrderHold.discretize(a, b, samplePeriod);
    }

    /** max |z| over the roots of z^2 - t z + d with t = m11 + m22, d = m11 m22 - m12 m21. */
    public static double spectralRadius(double m11, double m12, double m21, double m22) {
        double t = m11 + m22;
        double d = m11 * m22 - m12 * m21;
        double discriminant = t * t / 4 - d;
        if (discriminant < 0) {
            return Math.sqrt(d); // complex pair: |z|^2 = d
        }
        double root = Math.sqrt(discriminant);
        return Math.max(Math.abs(t / 2 + root), Math.abs(t / 2 - root));
    }
}
