package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.robustness.IndexingAxis;
import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.BracketedUnivariateSolver;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.events.AbstractODEDetector;
import org.hipparchus.ode.events.Action;
import org.hipparchus.ode.events.AdaptableInterval;
import org.hipparchus.ode.events.ODEEventHandler;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

/**
 * The saturated step against an independent route: Hipparchus' Dormand-Prince 8(5,3) integrator on
 * x' = A x + B sat(kr r - K x), with the switching instants located by its own event detection (common practice:
 * integrate piecewise-smooth systems between events so that the kink does not spoil the error control).
 */
class SaturatedStepVersusOdeTest {

    @Test
    void saturatedStepMatchesAnAdaptiveOdeIntegrationWithEvents() {
        double limit = 0.5;
        double horizon = 0.6;
        DenseTrajectory simulated =
                new SaturatedStepSimulator().simulate(IndexingAxis.PLANT, IndexingAxis.GAINS, 1, limit, horizon);
        double a0 = IndexingAxis.PLANT.a0();
        double a1 = IndexingAxis.PLANT.a1();
        double b = IndexingAxis.PLANT.b();
        FeedbackGains g = IndexingAxis.GAINS;
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            public int getDimension() {
                return 2;
            }

            public double[] computeDerivatives(double t, double[] y) {
                double u = SaturatedStepSimulator.saturate(
                        g.referenceGain() - g.positionGain() * y[0] - g.velocityGain() * y[1], limit);
                return new double[] {y[1], -a0 * y[0] - a1 * y[1] + b * u};
            }
        };
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-12, 1e-3, 1e-13, 1e-13);
        integrator.addEventDetector(new Switch(limit, g, 1));
        integrator.addEventDetector(new Switch(limit, g, -1));
        double[] t = simulated.timeSeconds();
        double[] x1 = simulated.x1();
        double[] x2 = simulated.x2();
        double[] state = {0, 0};
        double worst = 0;
        // compare every 200th grid point
        for (int k = 200; k < t.length; k += 200) {
            ODEStateAndDerivative result = integrator.integrate(ode, new ODEState(t[k - 200], state), t[k]);
            state = result.getPrimaryState();
            worst = Math.max(worst, Math.abs(state[0] - x1[k]));
            worst = Math.max(worst, Math.abs(state[1] - x2[k]) / 100);
        }
        assertEquals(0, worst, 1e-8);
    }

    /** g = s (kr r - K x) - limit: zero where the command crosses the limit of sign s. */
    private static final class Switch extends AbstractODEDetector<Switch> {
        private final double limit;
        private final FeedbackGains gains;
        private final double sign;

        Switch(double limit, FeedbackGains gains, double sign) {
            super(
                    (state, isForward) -> 1e-4,
                    100,
                    new BracketingNthOrderBrentSolver(1e-14, 1e-15, 5),
                    (s, detector, increasing) -> Action.RESET_DERIVATIVES);
            this.limit = limit;
            this.gains = gains;
            this.sign = sign;
        }

        private Switch(
                AdaptableInterval interval,
                int maxIterations,
                BracketedUnivariateSolver<UnivariateFunction> solver,
                ODEEventHandler handler,
                double limit,
                FeedbackGains gains,
                double sign) {
            super(interval, maxIterations, solver, handler);
            this.limit = limit;
            this.gains = gains;
            this.sign = sign;
        }

        @Override
        public double g(ODEStateAndDerivative s) {
            double[] y = s.getPrimaryState();
            return sign * (gains.referenceGain() - gains.positionGain() * y[0] - gains.velocityGain() * y[1]) - limit;
        }

        @Override
        protected Switch create(
                AdaptableInterval interval,
                int maxIterations,
                BracketedUnivariateSolver<UnivariateFunction> solver,
                ODEEventHandler handler) {
            return new Switch(interval, maxIterations, solver, handler, limit, gains, sign);
        }
    }
}
