package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.robustness.IndexingAxis;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

/**
 * The sampled, delayed loop against an independent route: Hipparchus' adaptive Dormand-Prince 8(5,3) integrator
 * over each constant-input piece, with the controller and the delay line written out separately here.
 */
class DelayedSampledStepVersusOdeTest {

    @Test
    void sampledDelayedLoopMatchesAnAdaptiveOdeIntegration() {
        double ts = 4e-3;
        double delay = 2.4 * ts; // two whole samples plus a fraction: exercises the split hold
        double horizon = 0.3;
        DenseTrajectory simulated = new DelayedSampledStepSimulator()
                .simulate(IndexingAxis.PLANT, IndexingAxis.GAINS, 1, ts, delay, horizon);
        double a0 = IndexingAxis.PLANT.a0();
        double a1 = IndexingAxis.PLANT.a1();
        double b = IndexingAxis.PLANT.b();
        FeedbackGains g = IndexingAxis.GAINS;
        int intervals = (int) Math.ceil(horizon / ts);
        double[] computed = new double[intervals];
        double[] x = {0, 0};
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-12, 1e-3, 1e-13, 1e-13);
        int perInterval = (simulated.length() - 1) / intervals;
        double[] x1 = simulated.x1();
        double[] x2 = simulated.x2();
        double worst = 0;
        for (int k = 0; k < intervals; k++) {
            computed[k] = g.referenceGain() - g.positionGain() * x[0] - g.velocityGain() * x[1];
            double start = k * ts;
            double[] end = null;
            for (int j = 1; j <= perInterval; j++) {
                double t = start + ts * j / perInterval;
                // integrate from the interval start to t through the pieces of constant input
                double[] state = x.clone();
                double from = start;
                // input applied at time s is u_i with i = floor((s - delay) / ts), 0 before the first arrives
                double[] breaks = {start + (delay - Math.floor(delay / ts) * ts), t};
                for (double to : breaks) {
                    to = Math.min(to, t);
                    if (to <= from) {
                        continue;
                    }
                    int i = (int) Math.floor((0.5 * (from + to) - delay) / ts + 1e-9);
                    double u = i < 0 ? 0 : computed[i];
                    OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
                        public int getDimension() {
                            return 2;
                        }

                        public double[] computeDerivatives(double time, double[] y) {
                            return new double[] {y[1], -a0 * y[0] - a1 * y[1] + b * u};
                        }
                    };
                    ODEStateAndDerivative result = integrator.integrate(ode, new ODEState(from, state), to);
                    state = result.getPrimaryState();
                    from = to;
                }
                int index = k * perInterval + j;
                worst = Math.max(worst, Math.abs(state[0] - x1[index]));
                worst = Math.max(worst, Math.abs(state[1] - x2[index]) / 100);
                end = state;
            }
            x = end;
        }
        assertEquals(0, worst, 1e-9);
    }
}
