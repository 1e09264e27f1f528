package com.loopwright.solver.norm;

import com.loopwright.solver.design.HInfinityNorm;
import java.util.Arrays;
import java.util.Objects;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;

/**
 * H-infinity norm {@code ||G||_inf = sup_w sigma_max(G(jw))} of G(s) = C (sI - A)^-1 B, A Hurwitz
 * (strictly proper, D = 0), as a certified upper bound.
 *
 * <p>Method: for A without imaginary-axis eigenvalues and gamma > 0 (= sigma_max(D), D = 0), gamma
 * is a singular value of G(jw) iff jw is an eigenvalue of the Hamiltonian
 * {@code M(gamma) = [[A, B B'/gamma^2], [-C'C, -A']]}; hence {@code gamma > ||G||_inf} iff M(gamma) has no
 * imaginary-axis eigenvalue. The level-set iteration keeps a lower bound gamma_lb = sigma_max(G(j w_peak))
 * attained at a known frequency: take the imaginary-axis eigenvalues j w_i of M(gamma_up) with
 * {@code gamma_up = (1 + RELATIVE_TOLERANCE) gamma_lb}, evaluate sigma_max at every w_i and at the midpoints of
 * consecutive w_i (and of 0 and w_1) and raise gamma_lb to the largest value found. It stops when M(gamma_up)
 * has no imaginary-axis eigenvalue (the final check), which certifies
 * {@code gamma_lb <= ||G||_inf <= gamma_up}. The peak frequency is then refined to a local maximum of
 * sigma_max(G(jw)) by Brent's method between its evaluated neighbours; if that raises gamma_lb above gamma_up,
 * the iteration resumes from the new level.
 *
 * <p>Result: {@link HInfinityNorm#value()} is gamma_up, never below the norm and at most a factor
 * {@code 1 + RELATIVE_TOLERANCE} above it; {@link HInfinityNorm#attainedGain()} is gamma_lb =
 * sigma_max(G(j peakFrequency)), never above the norm.
 *
 * <p>Numerical choices: the state coordinates are balanced first ({@link StateScaling}, a diagonal similarity by
 * powers of two): without it a companion-form closed loop whose coefficients span ten decades gives a
 * Hamiltonian whose computed eigenvalues are wrong by far more than the imaginary-axis band, so crossings were
 * missed and the norm came out below the true peak. B and C are rescaled to B s, C / s with
 * s = sqrt(||C||_F / ||B||_F), and M(gamma) is formed in the similar form {@code [[A, B B'/gamma], [-C'C/gamma,
 * -A']]} (similarity diag(I, gamma I)), whose off-diagonal blocks have equal size. An eigenvalue of M counts as
 * imaginary when {@code |Re lambda| <= IMAGINARY_AXIS_TOLERANCE * ||M||_F}. The only harmful error is to miss a
 * genuine crossing: a backward-stable eigenvalue solver moves simple eigenvalues by O(eps ||M||) and the nearly
 * double ones close to the peak by up to about sqrt(eps) ||M||, so the band is set well above both. A detection
 * that is not a genuine crossing only adds evaluation points: the set where sigma_max(G(jw)) > gamma_up is a
 * union of intervals whose ends are genuine crossings (or w = 0, which is always included), and every midpoint
 * of consecutive detected points inside such an interval lies in it. Hence, if no evaluation exceeds gamma_up,
 * there is no such interval and gamma_up bounds the norm.
 *
 * <p>Stateless and thread-safe.
 */
public final class HInfinityNormCalculator {

    /** Largest accepted state dimension n. */
    public static final int MAX_STATE_DIMENSION = 32;

    /**
     * Relative tolerance of the certificate: the returned value gamma_up satisfies
     * {@code ||G||_inf <= gamma_up <= (1 + RELATIVE_TOLERANCE) ||G||_inf}.
     */
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

    /** Cap on Brent refinements of the peak frequency (each may restart the level-set iteration once). */
    static final int MAX_REFINEMENTS = 4;

    /** Cap on sigma_max evaluations of one Brent refinement. */
    static final int MAX_BRENT_EVALUATIONS = 200;

    /** Brent's relative tolerance on the peak frequency; the gain is flat there, so it is accurate to its square. */
    static final double FREQUENCY_RELATIVE_TOLERANCE = 1e-10;

    /** Brent's absolute tolerance on the peak frequency, relative to the largest pole magnitude. */
    static final double FREQUENCY_ABSOLUTE_TOLERANCE = 1e-14;

    /** Above the largest evaluated frequency, the refinement bracket reaches this factor beyond the peak. */
    static final double OPEN_BRACKET_FACTOR = 2.0;

    /**
     * Computes the H-infinity norm and the frequency where it is attained.
     *
     * @param a n x n Hurwitz state matrix, 1 &lt;= n &lt;= {@value #MAX_STATE_DIMENSION}
     * @param b n x m input matrix, m &gt;= 1
     * @param c p x n output matrix, p &gt;= 1
     * @return the certified upper bound (value), the refined peak frequency and the gain attained there
     * @throws IllegalArgumentException for wrong shapes, n out of range or non-finite entries
     * @throws UnstableSystemException if A is not Hurwitz
     * @throws NormComputationException if the iteration fails to converge within its cap
     */
    public HInfinityNorm compute(DMatrixRMaj a, DMatrixRMaj b, DMatrixRMaj c) {
        int n = validate(a, b, c);
        // the poles and the Hurwitz margin are taken on the balanced A: a companion matrix whose last row spans
        // many decades has ||A||_F far above its poles, which would make any margin relative to it meaningless
        StateScaling.Balanced balanced = StateScaling.balance(a, b, c);
        DMatrixRMaj aBalanced = balanced.a();
        Complex_F64[] poles = eigenvalues(aBalanced, "A");
        requireHurwitz(poles, NormOps_DDRM.normF(aBalanced));

        double bNorm = NormOps_DDRM.normF(b);
        double cNorm = NormOps_DDRM.normF(c);
        if (bNorm == 0.0 || cNorm == 0.0) {
            return new HInfinityNorm(0.0, 0.0, 0);
        }
        // G = (C / s) (sI - A)^-1 (s B) for any s > 0
        double scale = Math.sqrt(NormOps_DDRM.normF(balanced.c()) / NormOps_DDRM.normF(balanced.b()));
        DMatrixRMaj bScaled = balanced.b().copy();
        CommonOps_DDRM.scale(scale, bScaled);
        DMatrixRMaj cScaled = balanced.c().copy();
        CommonOps_DDRM.scale(1.0 / scale, cScaled);
        FrequencyResponse response = new FrequencyResponse(aBalanced, bScaled, cScaled);

        // initial lower bound: DC and the pole magnitudes / damped frequencies (near resonances)
        double[] initialFrequencies = new double[1 + 2 * n];
        double largestPole = 0.0;
        for (int i = 0; i < n; i++) {
            initialFrequencies[1 + 2 * i] = poles[i].getMagnitude();
            initialFrequencies[2 + 2 * i] = Math.abs(poles[i].imaginary);
            largestPole = Math.max(largestPole, poles[i].getMagnitude());
        }
        Peak peak = Peak.best(response, initialFrequencies, Peak.start());
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

        int tests = 0;
        for (int refinement = 0; refinement <= MAX_REFINEMENTS; refinement++) {
            double upper = Double.NaN;
            while (Double.isNaN(upper)) {
                if (++tests > MAX_ITERATIONS) {
                    throw new NormComputationException("H-infinity norm iteration did not converge in " + MAX_ITERATIONS
                            + " Hamiltonian eigenvalue tests (last lower bound " + peak.gain() + " at "
                            + peak.frequency() + " rad/s); the system is probably too badly scaled");
                }
                double gamma = (1.0 + RELATIVE_TOLERANCE) * peak.gain();
                double[] crossings =
                        imaginaryAxisFrequencies(hamiltonian(aBalanced, bTimesBTranspose, cTransposeTimesC, gamma));
                Peak improved = Peak.best(response, midpoints(crossings), Peak.best(response, crossings, peak));
                if (!(improved.gain() > gamma)) {
                    // no detection (or only detections that are not genuine crossings: a genuine crossing
                    // interval would contain a midpoint with sigma_max > gamma): gamma bounds the norm
                    upper = gamma;
                }
                peak = improved;
            }
            Peak refined = refine(response, peak, FREQUENCY_ABSOLUTE_TOLERANCE * largestPole);
            if (!(refined.gain() > upper)) {
                return new HInfinityNorm(upper, refined.frequency(), refined.gain(), tests);
            }
            peak = refined;
        }
        throw new NormComputationException("the refined peak of sigma_max(G(jw)) kept rising above the certified level"
                + " after " + MAX_REFINEMENTS + " refinements (last " + peak.gain() + " at " + peak.frequency()
                + " rad/s); the system is probably too badly scaled");
    }

    /**
     * Brent's method (Hipparchus) on sigma_max(G(jw)) between the evaluated neighbours of the peak: the peak is
     * at least as large as both, so the bracket holds a local maximum. The better of the start and Brent's
     * answer is kept, so the gain never decreases. A peak at w = 0 stays there (sigma_max(G(jw)) is even in w).
     */
    private static Peak refine(FrequencyResponse response, Peak peak, double absoluteTolerance) {
        if (peak.frequency() == 0.0) {
            return peak;
        }
        double low = peak.below();
        double high = Double.isFinite(peak.above()) ? peak.above() : OPEN_BRACKET_FACTOR * peak.frequency();
        BrentOptimizer brent =
                new BrentOptimizer(FREQUENCY_RELATIVE_TOLERANCE, Math.max(absoluteTolerance, Double.MIN_NORMAL));
        UnivariatePointValuePair best;
        try {
            best = brent.optimize(
                    new MaxEval(MAX_BRENT_EVALUATIONS),
                    new UnivariateObjectiveFunction(response::maxSingularValue),
                    GoalType.MAXIMIZE,
                    new SearchInterval(low, high, peak.frequency()));
        } catch (MathIllegalStateException e) {
            // evaluation cap reached: keep the best evaluated point
            return peak;
        }
        double gain = response.maxSingularValue(best.getPoint());
        return gain > peak.gain() ? new Peak(best.getPoint(), gain, low, high) : peak;
    }

    /**
     * A frequency, sigma_max(G(j frequency)), and the nearest evaluated frequencies below and above it (0 and
     * +infinity when there are none), which bracket a local maximum when the peak is the best evaluation.
     */
    private record Peak(double frequency, double gain, double below, double above) {

        static Peak start() {
            return new Peak(0.0, 0.0, 0.0, Double.POSITIVE_INFINITY);
        }

        /** The best of {@code incumbent} and the evaluations at {@code frequencies}, with updated neighbours. */
        static Peak best(FrequencyResponse response, double[] frequencies, Peak incumbent) {
            double bestFrequency = incumbent.frequency();
            double bestGain = incumbent.gain();
            double[] evaluated = new double[frequencies.length];
            for (int i = 0; i < frequencies.length; i++) {
                double gain = response.maxSingularValue(frequencies[i]);
                evaluated[i] = gain;
                if (gain > bestGain) {
                    bestGain = gain;
                    bestFrequency = frequencies[i];
                }
            }
            double below = bestFrequency == incumbent.frequency() ? incumbent.below() : 0.0;
            double above = bestFrequency == incumbent.frequency() ? incumbent.above() : Double.POSITIVE_INFINITY;
            if (bestFrequency != incumbent.frequency()) {
                // the old peak is an evaluated point too
                below = incumbent.frequency() < bestFrequency ? incumbent.frequency() : below;
                above = incumbent.frequency() > bestFrequency ? incumbent.frequency() : above;
            }
            for (double w : frequencies) {
                if (w < bestFrequency) {
                    below = Math.max(below, w);
                } else if (w > bestFrequency) {
                    above = Math.min(above, w);
                }
            }
            return new Peak(bestFrequency, bestGain, below, above);
        }
    }

    /**
     * [[A, B B'/gamma], [-C'C/gamma, -A']], similar to M(gamma) = [[A, B B'/gamma^2], [-C'C, -A']] by
     * diag(I, gamma I), so it has the same eigenvalues with off-diagonal blocks of equal size.
     */
    private static DMatrixRMaj hamiltonian(
            DMatrixRMaj a, DMatrixRMaj bTimesBTranspose, DMatrixRMaj cTransposeTimesC, double gamma) {
        int n = a.numRows;
        double inverseGamma = 1.0 / gamma;
        DMatrixRMaj m = new DMatrixRMaj(2 * n, 2 * n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                m.set(i, j, a.get(i, j));
                m.set(i, n + j, bTimesBTranspose.get(i, j) * inverseGamma);
                m.set(n + i, j, -cTransposeTimesC.get(i, j) * inverseGamma);
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
                throw new NormComputationException(
                        "eigenvalue computation of " + name + " produced a non-finite value");
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
            throw new IllegalArgumentException(
                    "state dimension " + n + " exceeds the supported maximum " + MAX_STATE_DIMENSION);
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
                throw new IllegalArgumentException(
                        name + " has a non-finite entry at (" + i / m.numCols + ", " + i % m.numCols + ")");
            }
        }
    }
}
