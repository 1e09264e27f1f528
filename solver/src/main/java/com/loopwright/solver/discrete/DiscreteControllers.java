package com.loopwright.solver.discrete;

import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import org.ejml.data.DMatrixRMaj;

/** Builds {@link DiscreteController}s: today's plain law, and continuous designs discretized exactly (ZOH). */
public final class DiscreteControllers {

    private DiscreteControllers() {}

    /** u = kr r - (k1 x1 + k2 x2) with both states measured: no controller state. */
    public static DiscreteController fromStateFeedback(
            double samplePeriodSeconds, double positionGain, double velocityGain, double referenceGain) {
        return new DiscreteController(
                samplePeriodSeconds,
                new double[0][],
                new double[0][],
                new double[0],
                new double[0],
                new double[0],
                new double[] {positionGain, velocityGain},
                referenceGain,
                -1);
    }

    /**
     * The continuous controller q' = Ac q + By yd + br rd + bu ud with q = [xh; xi] (each part when present):
     * Ac = [[A - L C, 0], [0, 0]], By = [[L], [-e0']], br = [0; 1], bu = [B2; 0]; the law u = kr r - Kq q - Ky y
     * with Kq = [K, -ki] and Ky = 0 (observer) or Ky = K (full state, C = I). Discretized with the inputs held:
     * exp([[Ac, By, br, bu], [0, 0]] T) (Van Loan's block exponential).
     */
    public static DiscreteController fromContinuous(double samplePeriodSeconds, ContinuousControllerDesign design) {
        double[][] a = design.a();
        double[] b2 = design.b2();
        double[][] c = design.measuredOutput();
        double[][] l = design.observerGain();
        double[] k = design.stateGain();
        int n = b2.length;
        int p = c.length;
        boolean observer = design.hasObserver();
        boolean integrator = design.integralGain().isPresent();
        if (!observer && !isIdentity(c, n)) {
            throw new IllegalArgumentException("without an observer the full state must be measured (C = I)");
        }
        int nx = observer ? n : 0;
        int nq = nx + (integrator ? 1 : 0);
        double[] kq = new double[nq];
        double[] ky = new double[p];
        if (observer) {
            System.arraycopy(k, 0, kq, 0, n);
        } else {
            System.arraycopy(k, 0, ky, 0, n);
        }
        if (integrator) {
            kq[nx] = -design.integralGain().getAsDouble();
        }
        if (nq == 0) {
            return new DiscreteController(
                    samplePeriodSeconds,
                    new double[0][],
                    new double[0][],
                    new double[0],
                    new double[0],
                    new double[0],
                    ky,
                    design.referenceGain(),
                    -1);
        }
        int inputs = p + 2;
        DMatrixRMaj ac = new DMatrixRMaj(nq, nq);
        DMatrixRMaj bin = new DMatrixRMaj(nq, inputs);
        for (int i = 0; i < nx; i++) {
            for (int j = 0; j < n; j++) {
                double lc = 0;
                for (int m = 0; m < p; m++) {
                    lc += l[i][m] * c[m][j];
                }
                ac.set(i, j, a[i][j] - lc);
            }
            for (int m = 0; m < p; m++) {
                bin.set(i, m, l[i][m]);
            }
            bin.set(i, p + 1, b2[i]);
        }
        if (integrator) {
            bin.set(nx, 0, -1.0); // xi' = rd - yd[0]
            bin.set(nx, p, 1.0);
        }
        DiscreteStateSpace d = ZeroOrderHold.discretize(ac, bin, samplePeriodSeconds);
        double[][] phi = new double[nq][nq];
        double[][] gy = new double[nq][p];
        double[] gr = new double[nq];
        double[] gu = new double[nq];
        for (int i = 0; i < nq; i++) {
            for (int j = 0; j < nq; j++) {
                phi[i][j] = d.ad().get(i, j);
            }
            for (int m = 0; m < p; m++) {
                gy[i][m] = d.bd().get(i, m);
            }
            gr[i] = d.bd().get(i, p);
            gu[i] = d.bd().get(i, p + 1);
        }
        return new DiscreteController(
                samplePeriodSeconds, phi, gy, gr, gu, kq, ky, design.referenceGain(), integrator ? nx : -1);
    }

    private static boolean isIdentity(double[][] c, int n) {
        if (c.length != n) {
            return false;
        }
        for (int i = 0; i < n; i++) {
            if (c[i].length != n) {
                return false;
            }
            for (int j = 0; j < n; j++) {
                if (c[i][j] != (i == j ? 1.0 : 0.0)) {
                    return false;
                }
            }
        }
        return true;
    }
}
