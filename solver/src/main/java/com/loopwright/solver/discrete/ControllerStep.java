package com.loopwright.solver.discrete;

/**
 * The reference implementation of one controller sample; the exported Structured Text and C evaluate the same
 * expressions in the same order (so double runs agree to rounding). One instance is one running controller: it
 * holds q and the previous enable (not thread-safe; one per axis).
 *
 * <p>Per sample, with inputs enable, r, y, gain scale s, measured period Tm:
 *
 * <ol>
 *   <li>g = min(max(s, 0), 1); rd = r - y0[0]; yd = y - y0.
 *   <li>Bumpless enable: on the rising edge of enable, with an integrator at index i, Kq[i] != 0 and g &gt; 0,
 *       q[i] := (kr rd - sum_{l != i} Kq[l] q[l] - Ky yd + u0 / g) / Kq[i], so that u0 + g v = 0, the command
 *       held while disabled: the command does not jump. The observer states are not reset: they tracked the
 *       plant while disabled.
 *   <li>v = kr rd - (Kq q + Ky yd); enabled: u = clamp(u0 + g v, uMin, uMax); disabled: u = 0.
 *   <li>q+ = Phi q + Gy yd + gr rd + gu (u - u0): the observer is driven by the applied command.
 *   <li>Anti-windup by conditional integration: the integrator keeps q[i] (q+[i] := q[i]) while disabled, and
 *       while the command is clamped at uMax with -Kq[i] (q+[i] - q[i]) &gt; 0 or at uMin with
 *       -Kq[i] (q+[i] - q[i]) &lt; 0, i.e. whenever its step would drive the command further into the active
 *       limit. Chosen over back-calculation because it needs no extra tracking time constant to tune, leaves the
 *       designed dynamics untouched whenever the clamp is inactive, and is the same branch in ST and C.
 *   <li>periodMismatch = Tm - T &gt; tol T or T - Tm &gt; tol T.
 * </ol>
 */
public final class ControllerStep {

    private final DiscreteController controller;
    private final ControllerSettings settings;
    private final double[] q;
    private boolean wasEnabled;

    public ControllerStep(DiscreteController controller, ControllerSettings settings) {
        if (settings.measurementBias().length != controller.measuredCount()) {
            throw new IllegalArgumentException("one measurement bias per measured channel");
        }
        this.controller = controller;
        this.settings = settings;
        this.q = new double[controller.stateCount()];
    }

    /** The current controller state q (a copy). */
    public double[] state() {
        return q.clone();
    }

    public StepOutput step(
            boolean enable, double setpoint, double[] measured, double gainScale, double measuredPeriodSeconds) {
        int nq = controller.stateCount();
        int ny = controller.measuredCount();
        if (measured.length != ny) {
            throw new IllegalArgumentException("expected " + ny + " measured values");
        }
        double[] y0 = settings.measurementBias();
        double u0 = settings.commandBias();
        double[] kq = controller.stateGain();
        double[] ky = controller.measurementGain();
        double kr = controller.setpointGain();
        int ii = controller.integratorIndex();

        double g = gainScale > 1.0 ? 1.0 : (gainScale < 0.0 ? 0.0 : gainScale);
        double rd = setpoint - y0[0];
        double[] yd = new double[ny];
        for (int j = 0; j < ny; j++) {
            yd[j] = measured[j] - y0[j];
        }
        if (enable && !wasEnabled && ii >= 0 && kq[ii] != 0.0 && g > 0.0) {
            double rest = kr * rd;
            for (int l = 0; l < nq; l++) {
                if (l != ii) {
                    rest = rest - kq[l] * q[l];
                }
            }
            for (int j = 0; j < ny; j++) {
                rest = rest - ky[j] * yd[j];
            }
            q[ii] = (rest + u0 / g) / kq[ii];
        }
        double feedback = 0.0;
        boolean first = true;
        for (int l = 0; l < nq; l++) {
            feedback = first ? kq[l] * q[l] : feedback + kq[l] * q[l];
            first = false;
        }
        for (int j = 0; j < ny; j++) {
            feedback = first ? ky[j] * yd[j] : feedback + ky[j] * yd[j];
            first = false;
        }
        double v = kr * rd - feedback;
        double u;
        boolean high = false;
        boolean low = false;
        if (enable) {
            double uc = u0 + g * v;
            if (uc > settings.commandMax()) {
                u = settings.commandMax();
                high = true;
            } else if (uc < settings.commandMin()) {
                u = settings.commandMin();
                low = true;
            } else {
                u = uc;
            }
        } else {
            u = 0.0;
        }
        double ua = u - u0;
        double[][] phi = controller.stateMatrix();
        double[][] gy = controller.measurementInput();
        double[] gr = controller.setpointInput();
        double[] gu = controller.commandInput();
        double[] next = new double[nq];
        for (int l = 0; l < nq; l++) {
            double s = 0.0;
            boolean firstTerm = true;
            for (int m = 0; m < nq; m++) {
                s = firstTerm ? phi[l][m] * q[m] : s + phi[l][m] * q[m];
                firstTerm = false;
            }
            for (int j = 0; j < ny; j++) {
                s = firstTerm ? gy[l][j] * yd[j] : s + gy[l][j] * yd[j];
                firstTerm = false;
            }
            next[l] = s + gr[l] * rd + gu[l] * ua;
        }
        if (ii >= 0) {
            double push = -kq[ii] * (next[ii] - q[ii]);
            if (!enable || (high && push > 0.0) || (low && push < 0.0)) {
                next[ii] = q[ii];
            }
        }
        double tolerance = settings.periodToleranceFraction() * controller.samplePeriodSeconds();
        boolean mismatch = measuredPeriodSeconds - controller.samplePeriodSeconds() > tolerance
                || controller.samplePeriodSeconds() - measuredPeriodSeconds > tolerance;
        System.arraycopy(next, 0, q, 0, nq);
        wasEnabled = enable;
        return new StepOutput(u, high || low, !enable, mismatch);
    }
}
