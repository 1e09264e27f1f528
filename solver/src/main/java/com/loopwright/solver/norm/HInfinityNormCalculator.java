package com.loopwright.solver.norm;

import java.util.Arrays;
import java.util.Objects;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * H-infinity norm {@code ||G||_inf = sup_w sigma_max(G(jw))} of G(s) = C (sI - A)^-1 B, A Hurwitz
 * (strictly proper, D = 0).
 *
 * <p>Method: for A without imaginary-axis eigenvalues and gamma > 0 (= sigma_max(D), D = 0), gamma
 * is a singular value of G(jw) iff jw is an eigenvalue of the Hamiltonian
 * {@code M(gamma) = [[A, B B'/gamma^2], [-C'C, -A']]}; hence {@code gamma > ||G||_inf} iff M(gamma) has no imaginary-axis eigenvalue. The two-step iteration
 * keeps a lower bound gamma_lb = sigma_max(G(j w_peak)) attained at a known frequency: take the
 * imaginary-axis eigenvalues j w_i of M((1 + 2 tol) gamma_lb), evaluate sigma_max at the midpoints
 * of consecutive w_i (and of 0 and w_1) and raise gamma_lb to the largest value found; stop when
 * there are no imaginary-axis eigenvalues, which certifies
 * {@code gamma_lb <= ||G||_inf < (1 + 2 tol) gamma_lb}. Convergence is quadratic.
 *
 * <p>Numerical choices: B and C are rescaled to B s, C / s with s = sqrt(||C||_F / ||B||_F), which
 * leaves G unchanged and balances the blocks of M. An eigenvalue of M counts as imaginary when
 * {@code |Re lambda| <= IMAGINARY_AXIS_TOLERANCE * ||M||_F}. The only harmful error is to miss a
 * genuine crossing: a backward-stable eigenvalue solver moves simple eigenvalues by O(eps ||M||)
 * and the nearly double ones close to the peak by up to about sqrt(eps) ||M||, so the band is set
 * well above both. A detection that is not a genuine crossing only adds evaluation points: the set
 * where sigma_max(G(jw)) > gamma is a union of intervals whose ends are genuine crossings (or
 * w = 0, which is always included), and every midpoint of consecutive detected points inside such
 * an interval lies in it. Hence, if no midpoint exceeds gamma, there is no such interval, gamma
 * bounds the norm, and the best value found is returned.
 *
 * <p>Stateless and thread-safe.
 */
public final class HInfinityNormCalculator {

    /** Largest accepted state dimension n. */
    public static final int MAX_STATE_DIMENSION = 32;

    /** Relative tolerance tol: the returned value is within a factor (1 + 2 tol) below the norm. */
    public static final double RELATIVE_TOLERANCE = 1e-10;

    /**
     * Eigenvalues of M with |Re lambda| <= this * ||M||_F count as lying on the imaginary axis
     * (well above the sqrt(eps) ~ 1.5e-8 perturbation of nearly double eigenvalues).
     */
    public static final double IMAGINARY_AXIS_TOLERANCE = 1e-6;

    /**
     * A counts as Hurwitz only if every eigenvalue has {@code Re(lambda) < -HURWITZ_MARGIN * ||A||_F};
     * closer to the axis it cannot be told apart from a marginally stable mode in double precision.
     */
    public static final double HURWITZ_MARGIN = 1e-12;

    /** Hard cap on Hamiltonian eigenvalue tests; quadratic convergence typically needs 2-6. */
    static final int MAX_ITERATIONS = 100;

    /**
     * Computes the H-infinity norm and the frequency where it is attained.
     *
     * @param a n x n Hurwitz state matrix, 1 &lt;= n &lt;= {@value #MAX_STATE_DIMENSION}
     * @param b n x m input matrix, m &gt;= 1
     * @param c p x n output matrix, p &gt;= 1
     * @throws IllegalArgumentException for wrong shapes, n out of range or non-finite entries
     * @throws UnstableSystemException if A is not Hurwitz
     * @throws NormComputationException if the iteration fails to converge within its cap
     */
    public HInfinityNorm compute(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        int n = validate(a, b, c);
        Complex_F64[] poles = eigenvalues(a, "A");
        requireHurwitz(poles, NormOps_DDRM.normF(a));

        double bNorm = NormOps_DDRM.normF(b);
        double cNorm = NormOps_DDRM.normF(c);
        if (bNorm == 0.0 || cNorm == 0.0) {
            return new HInfinityNorm(0.0, 0.0, 0);
        }
        // G = (C / s) (sI - A)^-1 (s B) for any s > 0
        double scale = Math.sqrt(cNorm / bNorm);
        DMatrixRMaj bScaled = b.copy();
        CommonOps_DDRM.scale(scale, bScaled);
        DMatrixRMaj cScaled = c.copy();
        CommonOps_DDRM.scale(1.0 / scale, cScaled);
        FrequencyResponse response = new FrequencyResponse(a, bScaled, cScaled);

        // initial lower bound: DC and the pole magnitudes / damped frequencies (near resonances)
        double[] initialFrequencies = new double[1 + 2 * n];
        for (int i = 0; i < n; i++) {
            initialFrequencies[1 + 2 * i] = poles[i].getMagnitude();
            initialFrequencies[2 + 2 * i] = Math.abs(poles[i].imaginary);
        }
        Peak peak = Peak.best(response, initialFrequencies, new Peak(0.0, 0.0));
        if (peak.gain() == 0.0) {
            // a nonzero entry of G has at most n - 1 zeros, so n + 1 more distinct frequencies settle G = 0
            peak = Peak.best(response, logSpaced(poles, n), peak);
            if (peak.gain() == 0.0) {
                return new HInfinityNorm(0.0, 0.0, 0);
            }
        }

        DMatrixRMaj bTimesBTranspose = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransB(bScaled, bScaled, bTimesBTranspose);
        DMatrixRMaj cTransposeTimesC = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransA(cScaled, cScaled, cTransposeTimesC);

        for (int iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
            double gamma = (1.0 + 2.0 * RELATIVE_TOLERANCE) * peak.gain();
            double[] crossings = imaginaryAxisFrequencies(hamiltonian(a, bTimesBTranspose, cTransposeTimesC, gamma));
            if (crossings.length == 0) {
                return new HInfinityNorm(peak.gain(), peak.frequency(), iteration);
            }
            Peak improved = Peak.best(response, midpoints(crossings), peak);
            if (!(improved.gain() > gamma)) {
                // a genuine crossing interval would contain a midpoint with sigma_max > gamma; none
                // does, so the detections are not genuine crossings and gamma bounds the norm
                return new HInfinityNorm(improved.gain(), improved.frequency(), iteration);
            }
            peak = improved;
        }
        throw new NormComputationException("H-infinity norm iteration did not converge in " + MAX_ITERATIONS
                + " Hamiltonian eigenvalue tests (last lower bound " + peak.gain() + " at " + peak.frequency()
                + " rad/s); the system is probably too badly scaled");
    }

    /** A frequency and sigma_max(G(j frequency)). */
    private record Peak(double frequency, double gain) {

        /** The best of {@code incumbent} and the evaluations at {@code frequencies}. */
        static Peak best(FrequencyResponse response, double[] frequencies, Peak incumbent) {
            Peak best = incumbent;
            for (double w : frequencies) {
                double gain = response.maxSingularValue(w);
                if (gain > best.gain()) {
                    best = new Peak(w, gain);
                }
            }
            return best;
        }
    }

    /** M(gamma) = [[A, B B'/gamma^2], [-C'C, -A']]. */
    private static DMatrixRMaj hamiltonian(DMatrixRMaj a, DMatrixRMaj bTimesBTranspose, DMatrixRMaj cTransposeTimesC, double gamma) {
        int n = a.numRows;
        double inverseGammaSquared = 1.0 / (gamma * gamma);
        DMatrixRMaj m = new DMatrixRMaj(2 * n, 2 * n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                m.set(i, j, a.get(i, j));
                m.set(i, n + j, bTimesBTranspose.get(i, j) * inverseGammaSquared);
                m.set(n + i, j, -cTransposeTimesC.get(i, j));
                m.set(n + i, n + j, -a.get(j, i));
            }
        }
        return m;
    }

    /** Sorted w >= 0 with jw an (imaginary-axis, within tolerance) eigenvalue of M; one per conjugate pair. */
    private static double[] imaginaryAxisFrequencies(DMatrixRMaj m) {
        Complex_F64[] values = eigenvalues(m, "the Hamiltonian M(gamma)");
        double band = IMAGINARY_AXIS_TOLERANCE * NormOps_DDRM.normF(m);
        return Arrays.stream(values)
                .filter(lambda -> Math.abs(lambda.real) <= band && lambda.imaginary >= 0.0)
                .mapToDouble(lambda -> lambda.imaginary)
                .sorted()
                .toArray();
    }

    /** Midpoints of consecutive distinct entries of {0} united with the sorted crossings. */
    private static double[] midpoints(double[] sortedCrossings) {
        double[] points = new double[sortedCrossings.length];
        int count = 0;
        double previous = 0.0;
        for (double w : sortedCrossings) {
            if (w > previous) {
                points[count++] = 0.5 * (previous + w);
                previous = w;
            }
        }
        return Arrays.copyOf(points, count);
    }

    /** n + 1 log-spaced frequencies spanning the pole magnitudes (one decade beyond each side). */
    private static double[] logSpaced(Complex_F64[] poles, int n) {
        double smallest = Double.POSITIVE_INFINITY;
        double largest = 0.0;
        for (Complex_F64 pole : poles) {
            smallest = Math.min(smallest, pole.getMagnitude());
            largest = Math.max(largest, pole.getMagnitude());
        }
        double low = Math.log(smallest / 10);
        double high = Math.log(largest * 10);
        double[] frequencies = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            frequencies[i] = Math.exp(low + (high - low) * (i + 0.5) / (n + 1));
        }
        return frequencies;
    }

    private static Complex_F64[] eigenvalues(DMatrixRMaj m, String name) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(m.numRows, false);
        if (!eig.decompose(m.copy())) {
            throw new NormComputationException("eigenvalue computation of " + name + " did not converge");
        }
        Complex_F64[] values = new Complex_F64[eig.getNumberOfEigenvalues()];
        for (int i = 0; i < values.length; i++) {
            values[i] = eig.getEigenvalue(i);
            if (!Double.isFinite(values[i].real) || !Double.isFinite(values[i].imaginary)) {
                throw new NormComputationException("eigenvalue computation of " + name + " produced a non-finite value");
            }
        }
        return values;
    }

    private static void requireHurwitz(Complex_F64[] poles, double aNorm) {
        double abscissa = Double.NEGATIVE_INFINITY;
        for (Complex_F64 pole : poles) {
            abscissa = Math.max(abscissa, pole.real);
        }
        requireHurwitz(abscissa, aNorm);
    }

    /** Spectral abscissa below -HURWITZ_MARGIN ||A||_F, else {@link UnstableSystemException}. */
    static void requireHurwitz(double abscissa, double aNorm) {
        double margin = HURWITZ_MARGIN * aNorm;
        if (!(abscissa < -margin)) {
            throw new UnstableSystemException("A is not Hurwitz: its largest eigenvalue real part is " + abscissa
                    + " (required < " + (-margin) + "), so the H-infinity norm is infinite or undefined;"
                    + " stabilize the loop before evaluating its peak gain");
        }
    }

    private static int validate(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        Objects.requireNonNull(a, "A");
        Objects.requireNonNull(b, "B");
        Objects.requireNonNull(c, "C");
        int n = a.numRows;
        if (a.numCols != n || n == 0) {
            throw new IllegalArgumentException("A must be square and non-empty, got " + a.numRows + "x" + a.numCols);
        }
        if (n > MAX_STATE_DIMENSION) {
            throw new IllegalArgumentException("state dimension " + n + " exceeds the supported maximum " + MAX_STATE_DIMENSION);
        }
        if (b.numRows != n || b.numCols == 0) {
            throw new IllegalArgumentException("B must be " + n + "xm with m >= 1, got " + b.numRows + "x" + b.numCols);
        }
        if (c.numCols != n || c.numRows == 0) {
            throw new IllegalArgumentException("C must be px" + n + " with p >= 1, got " + c.numRows + "x" + c.numCols);
        }
        requireFinite(a, "A");
        requireFinite(b, "B");
        requireFinite(c, "C");
        return n;
    }

    static void requireFinite(DMatrixRMaj m, String name) {
        for (int i = 0; i < m.getNumElements(); i++) {
            if (!Double.isFinite(m.data[i])) {
                throw new IllegalArgumentException(name + " has a non-finite entry at (" + i / m.numCols + ", " + i % m.numCols + ")");
            }
        }
    }
}
