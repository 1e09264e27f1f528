package com.loopwright.solver.design;

import com.loopwright.solver.spec.TargetDynamics;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/**
 * An observer of the plant state from the measured output y_m = C_m x:
 * x_hat' = A x_hat + B2 u + L (y_m - C_m x_hat).
 *
 * @param method                 how L was chosen
 * @param gain                   L, one entry per plant state
 * @param poles                  the eigenvalues of A - L C_m (the estimation-error poles)
 * @param errorCovariance        the steady-state error covariance Y of the Kalman filter, null for a pole multiple
 * @param riccatiRelativeResidual the relative residual of Y in its Riccati equation, null for a pole multiple
 * @param processIntensity       q, the white-noise intensity at the disturbance input (Kalman), null otherwise
 * @param measurementIntensity   v, the white-noise intensity on the measurement (Kalman), null otherwise
 * @param poleMultiple           the multiple of the controller poles (pole multiple), null for Kalman
 */
public record ObserverDesign(
        Method method,
        double[] gain,
        List<TargetDynamics.Pole> poles,
        DMatrixRMaj errorCovariance,
        Double riccatiRelativeResidual,
        Double processIntensity,
        Double measurementIntensity,
        Double poleMultiple) {

    /** How the observer gain was chosen. */
    public enum Method {
        /** Steady-state Kalman filter: L = Y C_m' / v, Y from A Y + Y A' - Y C_m'C_m Y / v + q B1 B1' = 0. */
        STEADY_STATE_KALMAN,
        /** Observer poles at a multiple of the controller poles (Ackermann's formula on the observable pair). */
        POLE_MULTIPLE
    }

    public ObserverDesign {
        gain = gain.clone();
        poles = List.copyOf(poles);
        errorCovariance = errorCovariance == null ? null : errorCovariance.copy();
    }

    @Override
    public double[] gain() {
        return gain.clone();
    }

    @Override
    public DMatrixRMaj errorCovariance() {
        return errorCovariance == null ? null : errorCovariance.copy();
    }
}
