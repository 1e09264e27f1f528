package com.loopwright.solver.discrete;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.simulation.CheckedHoldStep;
import com.loopwright.solver.simulation.DelayedSampledStepSimulator;
import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * The reference step of a two-state plant x' = A x + B2 u under a {@link DiscreteController} run at its period,
 * enabled at full gain, unclamped, without bias and without delay, observed at and between the samples:
 *
 * <pre>
 *   u[k]   = kr r - (Kq q[k] + Ky C x(t_k))
 *   q[k+1] = Phi q[k] + Gy C x(t_k) + gr r + gu u[k]
 *   x(t_k + o) = Ad(o) x(t_k) + Bd(o) u[k],   0 &lt; o &lt;= T   (exact zero-order hold over the offset o)
 * </pre>
 *
 * with x(0) = 0, q[0] = 0. The offsets and caps are those of {@link DelayedSampledStepSimulator} (at most
 * {@value DelayedSampledStepSimulator#MAX_SAMPLE_INTERVALS} intervals, about
 * {@value DelayedSampledStepSimulator#TARGET_POINTS} observation points, at least
 * {@value DelayedSampledStepSimulator#MIN_SUBSTEPS} per interval). Stateless and thread-safe.
 */
public final class SampledControllerStep {

    /**
     * @param a        the plant's 2 x 2 state matrix
     * @param b2       its actuator column (2 entries)
     * @param measured C, one row of 2 entries per measured channel of the controller
     * @throws IllegalArgumentException when the horizon needs more than the interval cap or the state overflows
     */
    public DenseTrajectory simulate(
            DiscreteController controller,
            double[][] a,
            double[] b2,
            double[][] measured,
            double stepSize,
            double horizonSeconds) {
        checkShapes(controller, a, b2, measured);
        double period = controller.samplePeriodSeconds();
        double intervalsExact = Math.ceil(horizonSeconds / period);
        if (!(intervalsExact <= DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS)) {
            throw new IllegalArgumentException("the horizon " + horizonSeconds + " s needs more than "
                    + DelayedSampledStepSimulator.MAX_SAMPLE_INTERVALS + " sample intervals of " + period + " s");
        }
        int intervals = Math.max(1, (int) intervalsExact);
        int substeps = Math.max(
                DelayedSampledStepSimulator.MIN_SUBSTEPS,
                Math.min(
                        DelayedSampledStepSimulator.MAX_SUBSTEPS,
                        DelayedSampledStepSimulator.TARGET_POINTS / intervals));
        DMatrixRMaj am = new DMatrixRMaj(a);
        DMatrixRMaj bm = new DMatrixRMaj(2, 1, true, b2);
        DMatrixRMaj[] adOffset = new DMatrixRMaj[substeps + 1];
        DMatrixRMaj[] bdOffset = new DMatrixRMaj[substeps + 1];
        for (int j = 1; j <= substeps; j++) {
            DiscreteStateSpace hold = ZeroOrderHold.discretize(am, bm, period * j / substeps);
            adOffset[j] = hold.ad();
            bdOffset[j] = hold.bd();
        }
        int nq = controller.stateCount();
        int p = controller.measuredCount();
        double[][] phi = controller.stateMatrix();
        double[][] gy = controller.measurementInput();
        double[] gr = controller.setpointInput();
        double[] gu = controller.commandInput();
        double[] kq = controller.stateGain();
        double[] ky = controller.measurementGain();
        double kr = controller.setpointGain();
        int points = intervals * substeps + 1;
        double[] t = new double[points];
        double[] x1 = new double[points];
        double[] x2 = new double[points];
        double[] u = new double[points];
        double[] x = {0, 0};
        double[] q = new double[nq];
        int index = 0;
        for (int k = 0; k < intervals; k++) {
            double[] y = new double[p];
            for (int m = 0; m < p; m++) {
                y[m] = measured[m][0] * x[0] + measured[m][1] * x[1];
            }
            double command = kr * stepSize;
            for (int l = 0; l < nq; l++) {
                command -= kq[l] * q[l];
            }
            for (int m = 0; m < p; m++) {
                command -= ky[m] * y[m];
            }
            if (!Double.isFinite(command)) {
                throw new IllegalArgumentException("the command overflows double precision: the loop diverges");
            }
            if (k == 0) {
                u[0] = command;
            }
            double start = k * period;
            double[] end = x;
            for (int j = 1; j <= substeps; j++) {
                end = CheckedHoldStep.apply(adOffset[j], bdOffset[j], x, command);
                index++;
                t[index] = start + period * j / substeps;
                x1[index] = end[0];
                x2[index] = end[1];
                u[index] = command;
            }
            double[] next = new double[nq];
            for (int l = 0; l < nq; l++) {
                double s = gr[l] * stepSize + gu[l] * command;
                for (int m = 0; m < nq; m++) {
                    s += phi[l][m] * q[m];
                }
                for (int m = 0; m < p; m++) {
                    s += gy[l][m] * y[m];
                }
                next[l] = s;
            }
            x = end;
            q = next;
        }
        return new DenseTrajectory(t, x1, x2, u, new double[points]);
    }

    /**
     * x1 at rest, r = stepSize: the fixed point of [x; q][k+1] = M [x; q][k] + N r (the loop matrix of
     * {@link SampledLoopSpectrum} and N = [Bd kr; gr + gu kr]), solved as (I - M) z = N r.
     *
     * @throws IllegalArgumentException when I - M is singular (a sampled pole at z = 1)
     */
    public double finalValue(
            DiscreteController controller, double[][] a, double[] b2, double[][] measured, double stepSize) {
        checkShapes(controller, a, b2, measured);
        int nq = controller.stateCount();
        int p = controller.measuredCount();
        int size = 2 + nq;
        DiscreteStateSpace plant = ZeroOrderHold.discretize(
                new DMatrixRMaj(a), new DMatrixRMaj(2, 1, true, b2), controller.samplePeriodSeconds());
        double[] ky = controller.measurementGain();
        double[] kq = controller.stateGain();
        double[][] phi = controller.stateMatrix();
        double[][] gy = controller.measurementInput();
        double[] gu = controller.commandInput();
        double[] gr = controller.setpointInput();
        double kr = controller.setpointGain();
        double[] kyc = new double[2];
        for (int j = 0; j < 2; j++) {
            for (int m = 0; m < p; m++) {
                kyc[j] += ky[m] * measured[m][j];
            }
        }
        // I - M, row by row; N r on the right
        DMatrixRMaj lhs = new DMatrixRMaj(size, size);
        DMatrixRMaj rhs = new DMatrixRMaj(size, 1);
        for (int i = 0; i < 2; i++) {
            double bd = plant.bd().get(i, 0);
            for (int j = 0; j < 2; j++) {
                lhs.set(i, j, (i == j ? 1 : 0) - (plant.ad().get(i, j) - bd * kyc[j]));
            }
            for (int l = 0; l < nq; l++) {
                lhs.set(i, 2 + l, bd * kq[l]);
            }
            rhs.set(i, 0, bd * kr * stepSize);
        }
        for (int l = 0; l < nq; l++) {
            for (int j = 0; j < 2; j++) {
                double gyc = 0;
                for (int m = 0; m < p; m++) {
                    gyc += gy[l][m] * measured[m][j];
                }
                lhs.set(2 + l, j, -(gyc - gu[l] * kyc[j]));
            }
            for (int m = 0; m < nq; m++) {
                lhs.set(2 + l, 2 + m, (l == m ? 1 : 0) - (phi[l][m] - gu[l] * kq[m]));
            }
            rhs.set(2 + l, 0, (gr[l] + gu[l] * kr) * stepSize);
        }
        DMatrixRMaj z = new DMatrixRMaj(size, 1);
        if (!CommonOps_DDRM.solve(lhs, rhs, z) || !Double.isFinite(z.get(0, 0))) {
            throw new IllegalArgumentException("the sampled loop has no steady state (a pole at z = 1)");
        }
        return z.get(0, 0);
    }

    private static void checkShapes(DiscreteController controller, double[][] a, double[] b2, double[][] measured) {
        if (a.length != 2 || a[0].length != 2 || a[1].length != 2 || b2.length != 2) {
            throw new IllegalArgumentException("a two-state plant: A is 2 x 2 and B2 has 2 entries");
        }
        if (measured.length != controller.measuredCount()) {
            throw new IllegalArgumentException("one measured row per measured channel of the controller");
        }
        for (double[] row : measured) {
            if (row.length != 2) {
                throw new IllegalArgumentException("each measured row has 2 entries");
            }
        }
    }
}
