package com.loopwright.solver.discrete;

import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import java.util.OptionalDouble;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/**
 * The sampled loop of a plant x' = A x + B2 u, y = C x under a {@link DiscreteController}, enabled at full gain and
 * unclamped, with r = 0 and no bias: x[k+1] = Ad x + Bd u, q[k+1] = Phi q + Gy y + gu u, u = -(Kq q + Ky y), so
 *
 * <pre>
 *   [x; q][k+1] = [[Ad - Bd Ky C, -Bd Kq], [(Gy - gu Ky) C, Phi - gu Kq]] [x; q][k]
 * </pre>
 *
 * and its spectral radius (the largest |eigenvalue|) says whether the sampled loop is stable.
 */
public final class SampledLoopSpectrum {

    private SampledLoopSpectrum() {}

    /** The largest |eigenvalue| of the sampled loop matrix, or empty when the eigenvalue iteration fails. */
    public static OptionalDouble spectralRadius(
            DiscreteController controller, double[][] a, double[] b2, double[][] measuredOutput) {
        int n = b2.length;
        int p = measuredOutput.length;
        int nq = controller.stateCount();
        if (p != controller.measuredCount()) {
            throw new IllegalArgumentException("one measured row per measured channel");
        }
        DiscreteStateSpace plant = ZeroOrderHold.discretize(
                new DMatrixRMaj(a), new DMatrixRMaj(n, 1, true, b2), controller.samplePeriodSeconds());
        double[] ky = controller.measurementGain();
        double[] kq = controller.stateGain();
        double[][] phi = controller.stateMatrix();
        double[][] gy = controller.measurementInput();
        double[] gu = controller.commandInput();
        // u = -(KyC x + Kq q): the row KyC = Ky C
        double[] kyc = new double[n];
        for (int j = 0; j < n; j++) {
            for (int m = 0; m < p; m++) {
                kyc[j] += ky[m] * measuredOutput[m][j];
            }
        }
        DMatrixRMaj loop = new DMatrixRMaj(n + nq, n + nq);
        for (int i = 0; i < n; i++) {
            double bd = plant.bd().get(i, 0);
            for (int j = 0; j < n; j++) {
                loop.set(i, j, plant.ad().get(i, j) - bd * kyc[j]);
            }
            for (int l = 0; l < nq; l++) {
                loop.set(i, n + l, -bd * kq[l]);
            }
        }
        for (int l = 0; l < nq; l++) {
            for (int j = 0; j < n; j++) {
                double gyc = 0;
                for (int m = 0; m < p; m++) {
                    gyc += gy[l][m] * measuredOutput[m][j];
                }
                loop.set(n + l, j, gyc - gu[l] * kyc[j]);
            }
            for (int m = 0; m < nq; m++) {
                loop.set(n + l, n + m, phi[l][m] - gu[l] * kq[m]);
            }
        }
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(n + nq, false);
        if (!eig.decompose(loop)) {
            return OptionalDouble.empty();
        }
        double radius = 0;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            radius = Math.max(radius, eig.getEigenvalue(i).getMagnitude());
        }
        return OptionalDouble.of(radius);
    }
}
