package com.loopwright.solver.frequency;

import com.loopwright.solver.design.PlantInputMargins;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Margins of a loop of any order given as a state space broken at the plant input, L(s) = -c (sI - A)^-1 b
 * (the controller's states inside A). L(jw) comes from the real 2N x 2N system [[-A, -w I], [w I, -A]] [x_r; x_i]
 * = [b; 0] for (jw I - A)(x_r + j x_i) = b. Gain crossovers (|L| = 1) and phase crossovers (Im L = 0, Re L &lt; 0)
 * are bracketed on a log grid {@value #GRID_POINTS} points wide, {@value #DECADES_EACH_SIDE} decades beyond the
 * loop's slowest and fastest eigenvalue magnitudes, and bisected {@value #BISECTION_STEPS} times; phase and delay
 * margins follow {@link CrossoverMargins}, the rule of the Bode figure.
 */
public final class StateSpaceMargins {

    /** Frequencies on the grid. */
    public static final int GRID_POINTS = 3000;
    /** The grid reaches this many decades beyond the eigenvalue magnitudes. */
    public static final double DECADES_EACH_SIDE = 3;
    /** Bisection steps per bracketed crossing (relative width 1e-2 / 2^40 on the log grid). */
    static final int BISECTION_STEPS = 40;
    /** Largest state dimension N. */
    public static final int MAX_STATE_DIMENSION = 32;

    /**
     * @param a                the open-loop matrix, N x N
     * @param input            N x 1
     * @param command          1 x N
     * @param closedLoopMatrix the closed loop (to say whether it is stable)
     */
    public PlantInputMargins margins(
            DMatrixRMaj a, DMatrixRMaj input, DMatrixRMaj command, DMatrixRMaj closedLoopMatrix) {
        int n = a.numRows;
        if (n < 1 || n > MAX_STATE_DIMENSION) {
            throw new IllegalArgumentException("state dimension must lie in [1, " + MAX_STATE_DIMENSION + "]");
        }
        double[] open = magnitudeRange(a);
        double[] closed = magnitudeRange(closedLoopMatrix);
        double[] range = {Math.min(open[0], closed[0]), Math.max(open[1], closed[1])};
        double low = range[0] * Math.pow(10, -DECADES_EACH_SIDE);
        double high = range[1] * Math.pow(10, DECADES_EACH_SIDE);
        double[] w = LoopFrequencyAnalyzer.grid(low, high, GRID_POINTS);
        double[][] l = new double[GRID_POINTS][];
        double peakSensitivity = 0;
        double peakSensitivityAt = w[0];
        for (int i = 0; i < GRID_POINTS; i++) {
            l[i] = at(a, input, command, w[i]);
            double s = 1 / Math.hypot(1 + l[i][0], l[i][1]);
            if (s > peakSensitivity) {
                peakSensitivity = s;
                peakSensitivityAt = w[i];
            }
        }
        List<Double> gainCrossovers = new ArrayList<>();
        Double gainMargin = null;
        Double gainMarginAt = null;
        Double gainReduction = null;
        for (int i = 0; i + 1 < GRID_POINTS; i++) {
            double m0 = Math.hypot(l[i][0], l[i][1]) - 1;
            double m1 = Math.hypot(l[i + 1][0], l[i + 1][1]) - 1;
            if (m0 == 0 || m0 * m1 < 0) {
                if (gainCrossovers.size() < CrossoverMargins.MAX_CROSSOVERS) {
                    gainCrossovers.add(bisect(a, input, command, w[i], w[i + 1], true));
                }
            }
            if ((l[i][1] == 0 || l[i][1] * l[i + 1][1] < 0) && (l[i][0] < 0 || l[i + 1][0] < 0)) {
                double wc = bisect(a, input, command, w[i], w[i + 1], false);
                double[] lc = at(a, input, command, wc);
                if (lc[0] < 0) {
                    double magnitude = Math.hypot(lc[0], lc[1]);
                    if (magnitude < 1 && (gainMargin == null || 1 / magnitude < gainMargin)) {
                        gainMargin = 1 / magnitude;
                        gainMarginAt = wc;
                    } else if (magnitude > 1) {
                        gainReduction = gainReduction == null ? 1 / magnitude : Math.max(gainReduction, 1 / magnitude);
                    }
                }
            }
        }
        double[] crossovers = new double[gainCrossovers.size()];
        double[] phases = new double[crossovers.length];
        for (int i = 0; i < crossovers.length; i++) {
            crossovers[i] = gainCrossovers.get(i);
            double[] lc = at(a, input, command, crossovers[i]);
            phases[i] = Math.atan2(lc[1], lc[0]);
        }
        boolean stable = largestRealPart(closedLoopMatrix) < 0;
        Optional<CrossoverMargins> margins = CrossoverMargins.of(crossovers, phases, stable);
        return new PlantInputMargins(
                margins.map(CrossoverMargins::crossoverRadPerSec).orElse(null),
                margins.map(CrossoverMargins::phaseMarginDegrees).orElse(null),
                margins.map(CrossoverMargins::delayMarginSeconds).orElse(null),
                gainMargin,
                gainMarginAt,
                gainReduction,
                peakSensitivity,
                peakSensitivityAt,
                stable,
                GRID_POINTS);
    }

    /** L(jw) = -c (jw I - A)^-1 b as {re, im}. */
    public static double[] at(DMatrixRMaj a, DMatrixRMaj input, DMatrixRMaj command, double w) {
        int n = a.numRows;
        DMatrixRMaj m = new DMatrixRMaj(2 * n, 2 * n);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                m.set(i, j, -a.get(i, j));
                m.set(n + i, n + j, -a.get(i, j));
            }
            m.set(i, n + i, -w);
            m.set(n + i, i, w);
        }
        DMatrixRMaj rhs = new DMatrixRMaj(2 * n, 1);
        for (int i = 0; i < n; i++) {
            rhs.set(i, 0, input.get(i, 0));
        }
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(2 * n);
        if (!lu.setA(m)) {
            throw new IllegalArgumentException("the loop has a pole on the imaginary axis at w = " + w);
        }
        DMatrixRMaj x = new DMatrixRMaj(2 * n, 1);
        lu.solve(rhs, x);
        double re = 0;
        double im = 0;
        for (int j = 0; j < n; j++) {
            re -= command.get(0, j) * x.get(j, 0);
            im -= command.get(0, j) * x.get(n + j, 0);
        }
        return new double[] {re, im};
    }

    /** Bisection in log w on |L| - 1 (gain) or Im L (phase). */
    private static double bisect(
            DMatrixRMaj a, DMatrixRMaj input, DMatrixRMaj command, double lo, double hi, boolean gain) {
        double fLo = crossing(at(a, input, command, lo), gain);
        for (int step = 0; step < BISECTION_STEPS; step++) {
            double mid = Math.sqrt(lo * hi);
            double fMid = crossing(at(a, input, command, mid), gain);
            if (fMid == 0) {
                return mid;
            }
            if (fLo * fMid < 0) {
                hi = mid;
            } else {
                lo = mid;
                fLo = fMid;
            }
        }
        return Math.sqrt(lo * hi);
    }

    private static double crossing(double[] l, boolean gain) {
        return gain ? Math.hypot(l[0], l[1]) - 1 : l[1];
    }

    /** The smallest and largest non-zero eigenvalue magnitudes of A (1 when all are zero). */
    static double[] magnitudeRange(DMatrixRMaj a) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(a.numRows, false);
        if (!eig.decompose(a.copy())) {
            throw new IllegalArgumentException("the loop's eigenvalues could not be computed");
        }
        double min = Double.POSITIVE_INFINITY;
        double max = 0;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            double m = Math.hypot(eig.getEigenvalue(i).real, eig.getEigenvalue(i).imaginary);
            if (m > 1e-12 * (1 + max)) {
                min = Math.min(min, m);
                max = Math.max(max, m);
            }
        }
        return max == 0 ? new double[] {1, 1} : new double[] {min, max};
    }

    static double largestRealPart(DMatrixRMaj m) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(m.numRows, false);
        if (!eig.decompose(m.copy())) {
            return Double.NaN;
        }
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            max = Math.max(max, eig.getEigenvalue(i).real);
        }
        return max;
    }
}
