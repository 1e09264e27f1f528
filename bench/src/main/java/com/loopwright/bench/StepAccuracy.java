package com.loopwright.bench;

import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.spec.TargetDynamics;
import org.ejml.data.DMatrixRMaj;

/**
 * The loop both simulators run and the exact answer they are scored against. The indexing-axis design places
 * the closed loop at wn^2 / (s^2 + 2 zeta wn s + wn^2) from r to x1 (pole matching makes a0 + b k1 = wn^2 and
 * a1 + b k2 = 2 zeta wn), so the state-space loop is A = [[0, 1], [-wn^2, -2 zeta wn]], bRef = [0, wn^2]'.
 *
 * <p>source: step response of the standard underdamped second-order system, any control textbook:
 * y(t) = r (1 - e^(-zeta wn t) / sqrt(1 - zeta^2) sin(wd t + acos zeta)), wd = wn sqrt(1 - zeta^2).
 */
public final class StepAccuracy {

    /** Grid size the service simulates on (LoopDesigner.SIMULATION_SAMPLES). */
    public static final int SAMPLES = 2000;

    /** Three settling times, as the service simulates. */
    public static final double HORIZON_SECONDS = 3 * Scenarios.SETTLING_TIME_SECONDS;

    public static final double STEP_SIZE = 1.0;

    private StepAccuracy() {}

    public static LinearLoop loop(TargetDynamics target) {
        double wn = target.naturalFrequencyRadPerSec();
        double zeta = target.dampingRatio();
        return new LinearLoop(
                new DMatrixRMaj(new double[][] {{0, 1}, {-wn * wn, -2 * zeta * wn}}),
                new DMatrixRMaj(new double[][] {{0}, {wn * wn}}),
                new DMatrixRMaj(new double[][] {{1, 0}}),
                new DMatrixRMaj(new double[][] {{-wn * wn, -2 * zeta * wn}}),
                wn * wn);
    }

    /** Exact output y(t) for a step of size r. */
    public static double analyticOutput(TargetDynamics target, double stepSize, double timeSeconds) {
        double zeta = target.dampingRatio();
        double wn = target.naturalFrequencyRadPerSec();
        double root = Math.sqrt(1 - zeta * zeta);
        return stepSize
                * (1 - Math.exp(-zeta * wn * timeSeconds) / root * Math.sin(wn * root * timeSeconds + Math.acos(zeta)));
    }

    /** Largest |y[k] - y(t_k)| over the grid t_k = horizon k / (samples - 1). */
    public static double maxOutputError(TargetDynamics target, double[] output) {
        double worst = 0;
        for (int k = 0; k < output.length; k++) {
            double t = HORIZON_SECONDS * ((double) k / (output.length - 1));
            worst = Math.max(worst, Math.abs(output[k] - analyticOutput(target, STEP_SIZE, t)));
        }
        return worst;
    }
}
