package com.loopwright.solver.integral;

import com.loopwright.solver.design.LoadStepResponse;
import com.loopwright.solver.simulation.LinearLoop;
import com.loopwright.solver.simulation.StepResponse;
import com.loopwright.solver.simulation.StepSimulator;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * The response of a stable closed loop x' = A x + B1 w0, y = c x, u = k x to a constant load w0 from rest, by the
 * exact zero-order hold of the step simulator (the load takes the place of the reference). The steady offset is
 * the final-value theorem's y(inf) = lim s Y(s) = c (0 I - A)^-1 B1 w0 = -c A^-1 B1 w0.
 */
public final class LoadStepSimulator {

    /** The window covers this many slowest time constants 1/min|Re p| (e^-14 ~ 1e-6 of the slowest mode left). */
    static final double HORIZON_TIME_CONSTANTS = 14;
    /** Samples on the window (the recovery time is resolved to horizon / (SAMPLES - 1)). */
    public static final int SAMPLES = 20_000;

    private final StepSimulator simulator = new StepSimulator();

    /**
     * @throws IllegalArgumentException when A is not Hurwitz or the simulation overflows
     */
    public LoadStepResponse simulate(
            DMatrixRMaj a, DMatrixRMaj disturbance, DMatrixRMaj output, DMatrixRMaj command, double loadStepSize) {
        if (!(loadStepSize != 0) || !Double.isFinite(loadStepSize)) {
            throw new IllegalArgumentException("the load step must be finite and non-zero");
        }
        double slowest = slowestDecayRate(a);
        if (!(slowest > 0)) {
            throw new IllegalArgumentException("the closed loop is not stable: no load-step response");
        }
        double horizon = HORIZON_TIME_CONSTANTS / slowest;
        StepResponse response =
                simulator.simulate(new LinearLoop(a, disturbance, output, command, 0), loadStepSize, horizon, SAMPLES);
        double finalValue = finalValue(a, disturbance, output) * loadStepSize;
        double peak = 0;
        double peakTime = 0;
        double peakCommand = 0;
        double peakDeparture = 0;
        for (int k = 0; k < SAMPLES; k++) {
            double y = response.outputAt(k);
            if (Math.abs(y) > peak) {
                peak = Math.abs(y);
                peakTime = response.timeAt(k);
            }
            peakDeparture = Math.max(peakDeparture, Math.abs(y - finalValue));
            peakCommand = Math.max(peakCommand, Math.abs(response.controlAt(k)));
        }
        double band = LoadStepResponse.RECOVERY_BAND_FRACTION * peakDeparture;
        double recovery = 0;
        for (int k = SAMPLES - 1; k >= 0; k--) {
            if (Math.abs(response.outputAt(k) - finalValue) > band) {
                recovery = response.timeAt(Math.min(k + 1, SAMPLES - 1));
                break;
            }
        }
        return new LoadStepResponse(
                loadStepSize,
                finalValue,
                response.outputAt(SAMPLES - 1),
                peak,
                peakTime,
                recovery,
                peakCommand,
                horizon,
                SAMPLES);
    }

    /** -c A^-1 b: the DC gain from the load to the output (final-value theorem). */
    public static double finalValue(DMatrixRMaj a, DMatrixRMaj disturbance, DMatrixRMaj output) {
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(a.numRows);
        if (!lu.setA(a.copy())) {
            throw new IllegalArgumentException("the closed loop is singular");
        }
        DMatrixRMaj x = new DMatrixRMaj(a.numRows, 1);
        lu.solve(disturbance, x);
        DMatrixRMaj y = new DMatrixRMaj(1, 1);
        CommonOps_DDRM.mult(output, x, y);
        return -y.get(0, 0);
    }

    /** min over eigenvalues of -Re lambda (negative or zero when A is not Hurwitz). */
    static double slowestDecayRate(DMatrixRMaj a) {
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(a.numRows, false);
        if (!eig.decompose(a.copy())) {
            return Double.NaN;
        }
        double slowest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            slowest = Math.min(slowest, -eig.getEigenvalue(i).real);
        }
        return slowest;
    }
}
