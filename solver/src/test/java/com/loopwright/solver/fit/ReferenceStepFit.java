package com.loopwright.solver.fit;

import com.loopwright.solver.plant.StepTestData;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.util.Pair;

/**
 * An independent reference least-squares fit of y0 + K A S(wn (t - t_step - theta)) for the tests: the
 * textbook case formulas of {@link TextbookStep} (not the fitter's model), a central-difference Jacobian of
 * every parameter, and the reference library's Levenberg-Marquardt (Hipparchus) from a start the caller gives
 * (the generating parameters), with the dead time kept at or above 0 as a bounded solver would.
 * Parameters in the order gain, naturalFrequency, dampingRatio, deadTime, initialOffset.
 */
final class ReferenceStepFit {

    /** Relative step of the central differences. */
    private static final double DIFFERENCE_STEP = 1e-6;

    private static final int MAX_ITERATIONS = 500;
    private static final int MAX_EVALUATIONS = 2000;

    private ReferenceStepFit() {}

    /** RMS residual of the reference optimum, started at {K, wn, zeta, theta, y0}. */
    static double rmsError(StepTestData data, double[] start) {
        double[] t = data.timeSeconds();
        double[] y = data.output();
        double stepTime = data.stepTimeSeconds();
        double amplitude = data.stepAmplitude();
        LeastSquaresOptimizer.Optimum optimum = new LevenbergMarquardtOptimizer()
                .optimize(new LeastSquaresBuilder()
                        .start(start)
                        .target(y)
                        .model(point -> {
                            double[] x = point.toArray();
                            double[] values = values(t, stepTime, amplitude, x);
                            double[][] jacobian = new double[t.length][x.length];
                            for (int j = 0; j < x.length; j++) {
                                double h = DIFFERENCE_STEP * Math.max(Math.abs(x[j]), 1e-3);
                                double[] up = x.clone();
                                double[] down = x.clone();
                                up[j] += h;
                                down[j] = j == 3 ? Math.max(down[j] - h, 0) : down[j] - h;
                                double[] vu = values(t, stepTime, amplitude, up);
                                double[] vd = values(t, stepTime, amplitude, down);
                                for (int i = 0; i < t.length; i++) {
                                    jacobian[i][j] = (vu[i] - vd[i]) / (up[j] - down[j]);
                                }
                            }
                            return new Pair<RealVector, RealMatrix>(
                                    new ArrayRealVector(values, false), new Array2DRowRealMatrix(jacobian, false));
                        })
                        .parameterValidator(point -> {
                            double[] x = point.toArray();
                            x[1] = Math.abs(x[1]);
                            x[2] = Math.max(Math.abs(x[2]), 1e-6);
                            x[3] = Math.max(x[3], 0);
                            return new ArrayRealVector(x, false);
                        })
                        .maxIterations(MAX_ITERATIONS)
                        .maxEvaluations(MAX_EVALUATIONS)
                        .lazyEvaluation(false)
                        .build());
        return optimum.getRMS();
    }

    private static double[] values(double[] t, double stepTime, double amplitude, double[] x) {
        double[] v = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            v[i] = x[4] + x[0] * amplitude * TextbookStep.of(t[i] - stepTime - x[3], x[1], x[2]);
        }
        return v;
    }
}
