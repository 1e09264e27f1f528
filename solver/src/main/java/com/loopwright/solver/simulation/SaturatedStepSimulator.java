package com.loopwright.solver.simulation;

import com.loopwright.solver.design.DenseTrajectory;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.loop.LoopMatrices;
import com.loopwright.solver.numeric.BracketedRoot;
import com.loopwright.solver.plant.CanonicalPlant;
import org.ejml.data.DMatrixRMaj;

/**
 * The reference step of the continuous loop with an actuator limit: u = sat(kr r - (k1 x1 + k2 x2)), |u| &lt;= limit.
 *
 * <p>Method: the saturated loop is piecewise linear. In the linear mode x' = A_cl x + B2 kr r; in a saturated mode
 * x' = A x + B2 (+-limit). Each mode is propagated exactly by its zero-order hold (the input is constant), and a
 * switching instant, where |kr r - K x| crosses the limit, is located by bisection on the exact trajectory of the
 * current mode inside the grid step. A switch back and forth within one grid step is not seen; the grid is
 * {@link #GRID_POINTS} points over the horizon, far finer than the loop's time constants.
 */
public final class SaturatedStepSimulator {

    /** Grid points over the horizon; also the cap on the loop below. */
    public static final int GRID_POINTS = 20_001;
    /** Mode switches handled inside one grid step. */
    public static final int MAX_SWITCHES_PER_STEP = 4;

    private enum Mode {
        LINEAR,
        HIGH,
        LOW
    }

    public DenseTrajectory simulate(
            CanonicalPlant plant, FeedbackGains gains, double stepSize, double limit, double horizonSeconds) {
        DMatrixRMaj open = LoopMatrices.openLoop(plant);
        DMatrixRMaj closed = LoopMatrices.closedLoop(plant, gains);
        DMatrixRMaj b2 = LoopMatrices.actuatorInput(plant);
        double h = horizonSeconds / (GRID_POINTS - 1);
        DiscreteStateSpace linearStep = ZeroOrderHold.discretize(closed, b2, h);
        DiscreteStateSpace saturatedStep = ZeroOrderHold.discretize(open, b2, h);
        double[] t = new double[GRID_POINTS];
        double[] x1 = new double[GRID_POINTS];
        double[] x2 = new double[GRID_POINTS];
        double[] u = new double[GRID_POINTS];
        double[] x = {0, 0};
        double reference = gains.referenceGain() * stepSize;
        for (int k = 0; k < GRID_POINTS; k++) {
            if (k > 0) {
                x = advance(x, h, linearStep, saturatedStep, open, closed, b2, gains, reference, limit);
            }
            t[k] = horizonSeconds * ((double) k / (GRID_POINTS - 1));
            x1[k] = x[0];
            x2[k] = x[1];
            u[k] = saturate(reference - gains.positionGain() * x[0] - gains.velocityGain() * x[1], limit);
        }
        return new DenseTrajectory(t, x1, x2, u, new double[GRID_POINTS]);
    }

    private double[] advance(
            double[] x,
            double h,
            DiscreteStateSpace linearStep,
            DiscreteStateSpace saturatedStep,
            DMatrixRMaj open,
            DMatrixRMaj closed,
            DMatrixRMaj b2,
            FeedbackGains gains,
            double reference,
            double limit) {
        double remaining = h;
        for (int s = 0; s <= MAX_SWITCHES_PER_STEP && remaining > 0; s++) {
            Mode mode = modeAt(x, gains, reference, limit);
            boolean full = remaining == h;
            double[] end = full
                    ? propagate(x, mode == Mode.LINEAR ? linearStep : saturatedStep, mode, reference, limit)
                    : propagate(x, remaining, mode, open, closed, b2, reference, limit);
            if (modeAt(end, gains, reference, limit) == mode || s == MAX_SWITCHES_PER_STEP) {
                return end;
            }
            double[] start = x;
            // g(tau) = excess over the limit along the current mode's trajectory; changes sign at the switch
            double tau = BracketedRoot.bisection(
                    dt -> excess(
                            dt <= 0 ? start : propagate(start, dt, mode, open, closed, b2, reference, limit),
                            gains,
                            reference,
                            limit,
                            mode),
                    0,
                    remaining);
            tau = Math.max(tau, Math.ulp(remaining));
            x = propagate(start, Math.min(tau, remaining), mode, open, closed, b2, reference, limit);
            remaining -= tau;
            // step slightly past the switch so the new mode is seen
            if (modeAt(x, gains, reference, limit) == mode && remaining > 0) {
                double nudge = Math.min(remaining, 1e-9 * h);
                x = propagate(x, nudge, mode, open, closed, b2, reference, limit);
                remaining -= nudge;
            }
        }
        return x;
    }

    private static double excess(double[] x, FeedbackGains gains, double reference, double limit, Mode mode) {
        double command = reference - gains.positionGain() * x[0] - gains.velocityGain() * x[1];
        return switch (mode) {
            case LINEAR -> Math.abs(command) - limit;
            case HIGH -> command - limit;
            case LOW -> -command - limit;
        };
    }

    private static Mode modeAt(double[] x, FeedbackGains gains, double reference, double limit) {
        double command = reference - gains.positionGain() * x[0] - gains.velocityGain() * x[1];
        if (command > limit) {
            return Mode.HIGH;
        }
        return command < -limit ? Mode.LOW : Mode.LINEAR;
    }

    public static double saturate(double command, double limit) {
        return Math.max(-limit, Math.min(limit, command));
    }

    private static double[] propagate(
            double[] x,
            double dt,
            Mode mode,
            DMatrixRMaj open,
            DMatrixRMaj closed,
            DMatrixRMaj b2,
            double reference,
            double limit) {
        DiscreteStateSpace hold = ZeroOrderHold.discretize(mode == Mode.LINEAR ? closed : open, b2, dt);
        return propagate(x, hold, mode, reference, limit);
    }

    private static double[] propagate(double[] x, DiscreteStateSpace hold, Mode mode, double reference, double limit) {
        double input = switch (mode) {
            case LINEAR -> reference;
            case HIGH -> limit;
            case LOW -> -limit;
        };
        return CheckedHoldStep.apply(hold, x, input);
    }
}
