package com.loopwright.solver.discrete;

import com.loopwright.solver.simulation.DiscreteStateSpace;
import com.loopwright.solver.simulation.ZeroOrderHold;
import org.ejml.data.DMatrixRMaj;

/**
 * The service's own sampled simulation of an exported controller: the plant x' = A x + B2 (u - u0 + d) sampled
 * exactly under zero-order hold, x[k+1] = Ad x[k] + Bd (u[k] - u0 + d[k]), x[0] = 0, measured y = C x + y0, and
 * the controller by {@link ControllerStep}.
 */
public final class ClosedLoopSimulator {

    /**
     * @return rows {x[k] (n values), u[k], status[k]} for k = 0 .. steps - 1, x[k] the state the controller measured
     */
    public double[][] run(
            DiscreteController controller,
            ControllerSettings settings,
            double[][] a,
            double[] b2,
            double[][] measuredOutput,
            Scenario scenario) {
        int n = b2.length;
        int p = measuredOutput.length;
        DMatrixRMaj am = new DMatrixRMaj(a);
        DMatrixRMaj bm = new DMatrixRMaj(n, 1, true, b2);
        DiscreteStateSpace plant = ZeroOrderHold.discretize(am, bm, controller.samplePeriodSeconds());
        double[] y0 = settings.measurementBias();
        ControllerStep step = new ControllerStep(controller, settings);
        double[] r = scenario.setpoint();
        double[] d = scenario.load();
        boolean[] en = scenario.enable();
        double[] g = scenario.gainScale();
        double[] tm = scenario.measuredPeriodSeconds();
        double[][] rows = new double[scenario.steps()][];
        double[] x = new double[n];
        for (int k = 0; k < scenario.steps(); k++) {
            double[] y = new double[p];
            for (int m = 0; m < p; m++) {
                double s = 0;
                for (int j = 0; j < n; j++) {
                    s += measuredOutput[m][j] * x[j];
                }
                y[m] = s + y0[m];
            }
            StepOutput out = step.step(en[k], r[k], y, g[k], tm[k]);
            double[] row = new double[n + 2];
            System.arraycopy(x, 0, row, 0, n);
            row[n] = out.command();
            row[n + 1] = out.status();
            rows[k] = row;
            double input = out.command() - settings.commandBias() + d[k];
            double[] next = new double[n];
            for (int i = 0; i < n; i++) {
                double s = 0;
                for (int j = 0; j < n; j++) {
                    s += plant.ad().get(i, j) * x[j];
                }
                next[i] = s + plant.bd().get(i, 0) * input;
            }
            x = next;
        }
        return rows;
    }
}
