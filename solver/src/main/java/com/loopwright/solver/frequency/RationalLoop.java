package com.loopwright.solver.frequency;

import com.loopwright.solver.plant.CanonicalPlant;
import java.util.Arrays;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * An open-loop transfer function L(s) = N(s) / D(s) with real coefficients in ascending powers of s.
 *
 * @param numerator   n0 + n1 s + ...; at least one non-zero, at most {@value #MAX_COEFFICIENTS} entries
 * @param denominator d0 + d1 s + ...; highest entry non-zero, at most {@value #MAX_COEFFICIENTS} entries
 */
public record RationalLoop(double[] numerator, double[] denominator) {

    /** Largest number of polynomial coefficients (degree 15). */
    public static final int MAX_COEFFICIENTS = 16;

    public RationalLoop {
        numerator = checked(numerator, "numerator");
        denominator = checked(denominator, "denominator");
        if (denominator[denominator.length - 1] == 0) {
            throw new IllegalArgumentException("the leading denominator coefficient must be non-zero");
        }
        if (Arrays.stream(numerator).allMatch(c -> c == 0)) {
            throw new IllegalArgumentException("the numerator must not be identically zero");
        }
    }

    /**
     * The state-feedback loop broken at the plant input: with x' = A x + B u and u = -K x,
     * L(s) = K (sI - A)^-1 B. For the canonical plant A = [[0, 1], [-a0, -a1]], B = [0; b] and
     * K = [k1, k2], (sI - A)^-1 B = b [1; s] / (s^2 + a1 s + a0), so L(s) = b (k1 + k2 s) / (s^2 + a1 s + a0).
     */
    public static RationalLoop atPlantInput(CanonicalPlant plant, double positionGain, double velocityGain) {
        return new RationalLoop(
                new double[] {plant.b() * positionGain, plant.b() * velocityGain},
                new double[] {plant.a0(), plant.a1(), 1});
    }

    /** L(j w) as {re, im}, by Horner's rule in complex arithmetic. */
    public double[] at(double angularFrequencyRadPerSec) {
        double[] n = horner(numerator, angularFrequencyRadPerSec);
        double[] d = horner(denominator, angularFrequencyRadPerSec);
        double scale = d[0] * d[0] + d[1] * d[1];
        return new double[] {(n[0] * d[0] + n[1] * d[1]) / scale, (n[1] * d[0] - n[0] * d[1]) / scale};
    }

    /**
     * Whether the loop closed by unit negative feedback is stable: every zero of the characteristic polynomial
     * D(s) + N(s) has a negative real part. The zeros are the eigenvalues of its companion matrix (EJML).
     */
    public boolean closedLoopStable() {
        int length = Math.max(numerator.length, denominator.length);
        double[] p = new double[length];
        for (int i = 0; i < length; i++) {
            p[i] = (i < numerator.length ? numerator[i] : 0) + (i < denominator.length ? denominator[i] : 0);
        }
        int degree = length - 1;
        while (degree > 0 && p[degree] == 0) {
            degree--;
        }
        if (degree == 0) {
            return p[0] != 0; // a non-zero constant has no zeros
        }
        DMatrixRMaj companion = new DMatrixRMaj(degree, degree);
        for (int i = 0; i < degree; i++) {
            companion.set(0, i, -p[degree - 1 - i] / p[degree]);
            if (i > 0) {
                companion.set(i, i - 1, 1);
            }
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(degree, false);
        if (!eig.decompose(companion)) {
            throw new IllegalArgumentException("the closed-loop poles could not be computed");
        }
        for (int i = 0; i < degree; i++) {
            if (!(eig.getEigenvalue(i).getReal() < 0)) {
                return false;
            }
        }
        return true;
    }

    @Override
    public double[] numerator() {
        return numerator.clone();
    }

    @Override
    public double[] denominator() {
        return denominator.clone();
    }

    private static double[] horner(double[] coefficients, double w) {
        // p(jw) = (...((c_m jw + c_{m-1}) jw + ...) jw + c_0; multiply (re + j im) by j w: (-im w) + j (re w).
        double re = 0;
        double im = 0;
        for (int i = coefficients.length - 1; i >= 0; i--) {
            double nextRe = -im * w + coefficients[i];
            double nextIm = re * w;
            re = nextRe;
            im = nextIm;
        }
        return new double[] {re, im};
    }

    private static double[] checked(double[] coefficients, String name) {
        if (coefficients == null || coefficients.length < 1 || coefficients.length > MAX_COEFFICIENTS) {
            throw new IllegalArgumentException(name + " needs 1 to " + MAX_COEFFICIENTS + " coefficients");
        }
        for (double c : coefficients) {
            if (!Double.isFinite(c)) {
                throw new IllegalArgumentException(name + " coefficients must be finite");
            }
        }
        return coefficients.clone();
    }
}
