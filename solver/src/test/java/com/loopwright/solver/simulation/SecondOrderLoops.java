package com.loopwright.solver.simulation;

import java.util.Random;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;

/** Loops shared by the simulation tests. */
final class SecondOrderLoops {

    private SecondOrderLoops() {}

    /**
     * The double integrator y'' = u under state feedback u = -wn^2 x1 - 2 zeta wn x2 + wn^2 r:
     * A = [[0, 1], [-wn^2, -2 zeta wn]], bRef = [0, wn^2]', cOut = [1, 0], unit DC gain, and
     * u = y'' (the plant is a double integrator).
     */
    static LinearLoop stateFeedbackLoop(double zeta, double naturalFrequencyRadPerSecond) {
        double wn = naturalFrequencyRadPerSecond;
        return new LinearLoop(
                new DMatrixRMaj(new double[][] {{0, 1}, {-wn * wn, -2 * zeta * wn}}),
                new DMatrixRMaj(new double[][] {{0}, {wn * wn}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{-wn * wn, -2 * zeta * wn}}),
                wn * wn);
    }

    /** The same loop with u taken as the velocity x2 = y' (no feedthrough). */
    static LinearLoop velocityAsControl(double zeta, double naturalFrequencyRadPerSecond) {
        LinearLoop loop = stateFeedbackLoop(zeta, naturalFrequencyRadPerSecond);
        return new LinearLoop(loop.a(), loop.bRef(), loop.cOut(), new DMatrixRMaj(new double[][] {{0, 1}}), 0.0);
    }

    /**
     * A random stable loop of order n: A = G - (max Re lambda(G) + margin) I with Gaussian G, so
     * every eigenvalue of A has real part <= -margin; Gaussian bRef, cOut, cControl.
     */
    static LinearLoop randomStableLoop(long seed, int n, double margin) {
        Random random = new Random(seed);
        DMatrixRMaj g = gaussian(random, n, n);
        EigenDecomposition_F64<DMatrixRMaj> eigen = DecompositionFactory_DDRM.eig(n, false, false);
        if (!eigen.decompose(g.copy())) {
            throw new IllegalStateException("eigen decomposition failed");
        }
        double maxReal = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            Complex_F64 eigenvalue = eigen.getEigenvalue(i);
            maxReal = Math.max(maxReal, eigenvalue.real);
        }
        for (int i = 0; i < n; i++) {
            g.add(i, i, -(maxReal + margin));
        }
        return new LinearLoop(
                g, gaussian(random, n, 1), gaussian(random, 1, n), gaussian(random, 1, n), random.nextGaussian());
    }

    /** x' = A x + bRef r as a Hipparchus ODE, for the independent Dormand-Prince reference. */
    static org.hipparchus.ode.OrdinaryDifferentialEquation referenceOde(LinearLoop loop, double r) {
        int n = loop.stateDimension();
        DMatrixRMaj a = loop.a();
        DMatrixRMaj bRef = loop.bRef();
        return new org.hipparchus.ode.OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return n;
            }

            @Override
            public double[] computeDerivatives(double t, double[] x) {
                double[] xDot = new double[n];
                for (int i = 0; i < n; i++) {
                    xDot[i] = bRef.get(i, 0) * r;
                    for (int j = 0; j < n; j++) {
                        xDot[i] += a.get(i, j) * x[j];
                    }
                }
                return xDot;
            }
        };
    }

    private static DMatrixRMaj gaussian(Random random, int rows, int cols) {
        DMatrixRMaj matrix = new DMatrixRMaj(rows, cols);
        for (int i = 0; i < matrix.getNumElements(); i++) {
            matrix.data[i] = random.nextGaussian();
        }
        return matrix;
    }
}
