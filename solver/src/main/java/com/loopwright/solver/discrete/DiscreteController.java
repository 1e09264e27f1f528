package com.loopwright.solver.discrete;

/**
 * A linear discrete controller run once per task period T, in deviation coordinates (rd = r - y0[0],
 * yd = y - y0, ud = u - u0; see {@link ControllerSettings}):
 *
 * <pre>
 *   v[k]   = kr rd[k] - (Kq q[k] + Ky yd[k])                        the law
 *   q[k+1] = Phi q[k] + Gy yd[k] + gr rd[k] + gu ud_applied[k]        the controller state
 * </pre>
 *
 * where ud_applied is the command actually applied (after gain scale, bias and clamp, or the disabled command),
 * so an observer in q sees the true plant input. The matrices come from a continuous-time controller
 * q' = Ac q + By yd + br rd + bu ud discretized exactly under zero-order hold (all inputs held over the period):
 * exp([[Ac, By, br, bu], [0, 0, 0, 0]] T) = [[Phi, Gy, gr, gu], [0, I]]. A plain state-feedback law has no state.
 *
 * @param samplePeriodSeconds the design task period T [s]
 * @param stateMatrix         Phi, nq x nq
 * @param measurementInput    Gy, nq x ny
 * @param setpointInput       gr, nq
 * @param commandInput        gu, nq
 * @param stateGain           Kq, nq
 * @param measurementGain     Ky, ny (ny &gt;= 1; the first measured channel is the controlled position)
 * @param setpointGain        kr, the reference feedforward
 * @param integratorIndex     the index in q of the integrator of r - y[0], or -1 without integral action
 */
public record DiscreteController(
        double samplePeriodSeconds,
        double[][] stateMatrix,
        double[][] measurementInput,
        double[] setpointInput,
        double[] commandInput,
        double[] stateGain,
        double[] measurementGain,
        double setpointGain,
        int integratorIndex) {

    /** Most controller states (observer of order n plus one integrator). */
    public static final int MAX_STATES = 12;
    /** Most measured channels. */
    public static final int MAX_MEASURED = 12;

    public DiscreteController {
        int nq = stateGain.length;
        int ny = measurementGain.length;
        if (nq > MAX_STATES || ny < 1 || ny > MAX_MEASURED) {
            throw new IllegalArgumentException("need 0 <= nq <= " + MAX_STATES + " and 1 <= ny <= " + MAX_MEASURED);
        }
        if (!(samplePeriodSeconds > 0) || !Double.isFinite(samplePeriodSeconds)) {
            throw new IllegalArgumentException("the sample period must be finite and positive");
        }
        stateMatrix = copy(stateMatrix, nq, nq, "stateMatrix");
        measurementInput = copy(measurementInput, nq, ny, "measurementInput");
        setpointInput = copy(setpointInput, nq, "setpointInput");
        commandInput = copy(commandInput, nq, "commandInput");
        stateGain = copy(stateGain, nq, "stateGain");
        measurementGain = copy(measurementGain, ny, "measurementGain");
        if (!Double.isFinite(setpointGain)) {
            throw new IllegalArgumentException("setpointGain must be finite");
        }
        if (integratorIndex < -1 || integratorIndex >= nq) {
            throw new IllegalArgumentException("integratorIndex must be -1 or a state index");
        }
    }

    /** nq, the number of controller states. */
    public int stateCount() {
        return stateGain.length;
    }

    /** ny, the number of measured channels. */
    public int measuredCount() {
        return measurementGain.length;
    }

    public boolean hasIntegrator() {
        return integratorIndex >= 0;
    }

    @Override
    public double[][] stateMatrix() {
        return copy(stateMatrix, stateMatrix.length, stateCount(), "stateMatrix");
    }

    @Override
    public double[][] measurementInput() {
        return copy(measurementInput, measurementInput.length, measuredCount(), "measurementInput");
    }

    @Override
    public double[] setpointInput() {
        return setpointInput.clone();
    }

    @Override
    public double[] commandInput() {
        return commandInput.clone();
    }

    @Override
    public double[] stateGain() {
        return stateGain.clone();
    }

    @Override
    public double[] measurementGain() {
        return measurementGain.clone();
    }

    private static double[][] copy(double[][] m, int rows, int cols, String name) {
        if (m.length != rows) {
            throw new IllegalArgumentException(name + " must have " + rows + " rows");
        }
        double[][] c = new double[rows][];
        for (int i = 0; i < rows; i++) {
            c[i] = copy(m[i], cols, name);
        }
        return c;
    }

    private static double[] copy(double[] v, int length, String name) {
        if (v.length != length) {
            throw new IllegalArgumentException(name + " must have " + length + " entries");
        }
        for (double x : v) {
            if (!Double.isFinite(x)) {
                throw new IllegalArgumentException(name + " must be finite");
            }
        }
        return v.clone();
    }
}
