package com.loopwright.bench;

import com.loopwright.solver.simulation.LinearLoop;
import org.ejml.data.DMatrixRMaj;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.ode.sampling.ODEStateInterpolator;
import org.hipparchus.ode.sampling.ODEStepHandler;

/**
 * The reference simulation: x' = A x + bRef r from x(0) = 0 by Hipparchus DormandPrince853Integrator (adaptive
 * 8th-order Runge-Kutta) in one integration over the horizon, with the output sampled on the same uniform grid
 * as the ZOH recursion through the integrator's dense output. Returns x1 at the grid points.
 */
public final class DormandPrinceStep {

    /** Absolute and relative tolerance of the adaptive step control. */
    public static final double TOLERANCE = 1e-12;

    private final int n;
    private final double[] a;
    private final double[] bRef;
    private final double stepSize;

    public DormandPrinceStep(LinearLoop loop, double stepSize) {
        DMatrixRMaj matrix = loop.a();
        this.n = matrix.numRows;
        this.a = matrix.data.clone();
        this.bRef = loop.bRef().data.clone();
        this.stepSize = stepSize;
    }

    public double[] simulate(double horizonSeconds, int samples) {
        double[] output = new double[samples];
        DormandPrince853Integrator integrator =
                new DormandPrince853Integrator(1e-12 * horizonSeconds, horizonSeconds, TOLERANCE, TOLERANCE);
        integrator.addStepHandler(new GridSampler(output, horizonSeconds));
        integrator.integrate(new Ode(), new ODEState(0.0, new double[n]), horizonSeconds);
        return output;
    }

    private final class Ode implements OrdinaryDifferentialEquation {
        @Override
        public int getDimension() {
            return n;
        }

        @Override
        public double[] computeDerivatives(double t, double[] x) {
            double[] xDot = new double[n];
            for (int i = 0; i < n; i++) {
                double sum = bRef[i] * stepSize;
                for (int j = 0; j < n; j++) {
                    sum += a[i * n + j] * x[j];
                }
                xDot[i] = sum;
            }
            return xDot;
        }
    }

    /** Writes x1 at every grid time covered by each accepted step. */
    private static final class GridSampler implements ODEStepHandler {
        private final double[] output;
        private final double horizonSeconds;
        private int next;

        GridSampler(double[] output, double horizonSeconds) {
            this.output = output;
            this.horizonSeconds = horizonSeconds;
        }

        @Override
        public void handleStep(ODEStateInterpolator interpolator) {
            double end = interpolator.getCurrentState().getTime();
            while (next < output.length) {
                double t = horizonSeconds * ((double) next / (output.length - 1));
                if (t > end) {
                    break;
                }
                ODEStateAndDerivative state = interpolator.getInterpolatedState(t);
                output[next++] = state.getPrimaryState()[0];
            }
        }

        @Override
        public void finish(ODEStateAndDerivative finalState) {
            while (next < output.length) {
                output[next++] = finalState.getPrimaryState()[0];
            }
        }
    }
}
