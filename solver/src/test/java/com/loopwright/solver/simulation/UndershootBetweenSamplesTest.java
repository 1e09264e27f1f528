package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.HighOrderStep;
import com.loopwright.solver.highorder.ClosedLoopStep;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.SpecInverter;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import org.ejml.data.DMatrixRMaj;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.LUDecomposition;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;
import org.junit.jupiter.api.Test;

/** The undershoot is refined between samples, like the overshoot. */
class UndershootBetweenSamplesTest {

    /** Coarse scan steps of the reference before Brent (cap). */
    static final int REFERENCE_SCAN_STEPS = 400;

    /**
     * Issue 12, item 5: POST /v1/designs/high-order with denominator [0.009078623638924007, 0.09303427763201173,
     * 0.41839321133113727, 1.192578756140489], b 0.04340825295325368, numerator [1, -0.5782773668692388, 0, 0],
     * disturbance [0, 0, 0, 0.022057260905507935], settling 12.039949496201748 s in a 5 % band, overshoot
     * 0.24565128665507857 % (no spec matching, default auxiliary poles at 4x the dominant real part, 2000 samples)
     * reported 0.389865 % from the samples; the independent check gives 0.389930 % at t = 1.246 s.
     * Outside reference here: Hipparchus Dormand-Prince 8(5,3) on x' = A x + b r (tolerances 1e-14), minimised
     * by Hipparchus' Brent optimizer after a coarse scan.
     */
    @Test
    void undershootOfTheNonMinimumPhaseOrderFourLoopIsRefined() {
        CompanionPlant plant = new CompanionPlant(
                new double[] {0.009078623638924007, 0.09303427763201173, 0.41839321133113727, 1.192578756140489},
                new double[] {1.0, -0.5782773668692388, 0, 0},
                0.04340825295325368,
                new double[] {0, 0, 0, 0.022057260905507935});
        TargetDynamics target = new SpecInverter()
                .invert(new DesignSpec(0.24565128665507857 / 100, new TimeSpec.SettlingTime(12.039949496201748, 0.05)))
                .target();
        DesiredPoles poles = DesiredPoles.atMultiple(target, 4, DesiredPoles.DEFAULT_REAL_PART_MULTIPLE);
        HighOrderStep result = new ClosedLoopStep().simulate(plant, poles, 1.0, 0.05, 12.039949496201748);
        assertEquals(2000, result.samples());

        LinearLoop loop = ClosedLoopStep.loop(plant, poles.coefficients());
        double[] reference = referenceUndershoot(loop, result.horizonSeconds());
        // the values, to the digits it states
        assertEquals(0.389930, result.undershootPercent(), 5e-7);
        assertEquals(1.246, reference[0], 5e-4);
        assertEquals(
                reference[1],
                result.undershootPercent(),
                1e-9 * reference[1],
                "refined undershoot vs Dormand-Prince + Brent");
        // the largest sample alone is farther off than the refinement is
        assertTrue(reference[1] - 0.389865 > 50 * Math.abs(reference[1] - result.undershootPercent()));
    }

    /** {time, 100 max(0, -min y / y_inf)} by ODE integration and Brent, y_inf = -c A^-1 b r. */
    private static double[] referenceUndershoot(LinearLoop loop, double horizon) {
        RealMatrix a = hipparchus(loop.a());
        RealMatrix bRef = hipparchus(loop.bRef());
        double[] c = loop.cOut().data.clone();
        double finalValue = -new ArrayRealVector(c)
                .dotProduct(new LUDecomposition(a).getSolver().solve(bRef.getColumnVector(0)));
        double dt = horizon / REFERENCE_SCAN_STEPS;
        double bestT = 0;
        double bestZ = 0;
        for (int i = 1; i <= REFERENCE_SCAN_STEPS; i++) {
            double z = normalisedOutput(a, bRef, c, finalValue, i * dt);
            if (z < bestZ) {
                bestZ = z;
                bestT = i * dt;
            }
        }
        if (bestT == 0) {
            return new double[] {0, 0};
        }
        UnivariatePointValuePair min = new BrentOptimizer(1e-12, 1e-14)
                .optimize(
                        new MaxEval(200),
                        new UnivariateObjectiveFunction(t -> normalisedOutput(a, bRef, c, finalValue, t)),
                        GoalType.MINIMIZE,
                        new SearchInterval(bestT - dt, bestT + dt, bestT));
        return new double[] {min.getPoint(), Math.max(0, -100 * min.getValue())};
    }

    private static double normalisedOutput(RealMatrix a, RealMatrix bRef, double[] c, double finalValue, double t) {
        int n = a.getRowDimension();
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return n;
            }

            @Override
            public double[] computeDerivatives(double time, double[] x) {
                double[] dx = a.operate(x);
                for (int i = 0; i < n; i++) {
                    dx[i] += bRef.getEntry(i, 0);
                }
                return dx;
            }
        };
        double[] x = new DormandPrince853Integrator(1e-10, 1.0, 1e-14, 1e-14)
                .integrate(ode, new ODEState(0, new double[n]), t)
                .getPrimaryState();
        return new ArrayRealVector(c).dotProduct(new ArrayRealVector(x)) / finalValue;
    }

    private static RealMatrix hipparchus(DMatrixRMaj m) {
        double[][] rows = new double[m.numRows][m.numCols];
        for (int i = 0; i < m.numRows; i++) {
            for (int j = 0; j < m.numCols; j++) {
                rows[i][j] = m.get(i, j);
            }
        }
        return new Array2DRowRealMatrix(rows, false);
    }
}
