package com.loopwright.solver.observer;

import com.loopwright.solver.design.ObserverDesign;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * Observer gains for x' = A x + B1 w + B2 u, y_m = C_m x + v.
 *
 * <p>Steady-state Kalman filter: the dual of the control Riccati equation,
 * A Y + Y A' - Y C_m'C_m Y / v + q B1 B1' = 0, solved by the Hamiltonian solver as A~'Y + Y A~ + Y R Y + Q = 0 with
 * A~ = A', R = -C_m'C_m / v, Q = q B1 B1'; its stabilizing solution makes A - L C_m Hurwitz, L = Y C_m' / v.
 *
 * <p>Pole multiple: the observer poles are the controller's poles times a multiple (faster by that factor, same
 * damping), placed by Ackermann's formula L = phi(A) O^-1 e_n with O the observability matrix of (A, C_m).
 */
public final class ObserverDesigner {

    /** The observability matrix counts as singular below this reciprocal condition (common practice). */
    static final double MIN_RECIPROCAL_CONDITION = 1e-13;

    private final HamiltonianRiccatiSolver riccati = new HamiltonianRiccatiSolver();

    /**
     * @param processIntensity     q &gt; 0, white-noise intensity at the disturbance input
     * @param measurementIntensity v &gt; 0, white-noise intensity of the measurement
     * @throws com.loopwright.solver.riccati.NoStabilizingSolutionException when (A, C_m) is not detectable
     */
    public ObserverDesign kalman(
            DMatrixRMaj a,
            DMatrixRMaj disturbance,
            DMatrixRMaj measuredRow,
            double processIntensity,
            double measurementIntensity) {
        if (!(processIntensity > 0) || !Double.isFinite(processIntensity)) {
            throw new IllegalArgumentException("the process intensity must be positive and finite");
        }
        if (!(measurementIntensity > 0) || !Double.isFinite(measurementIntensity)) {
            throw new IllegalArgumentException("the measurement intensity must be positive and finite");
        }
        int n = a.numRows;
        DMatrixRMaj transposed = new DMatrixRMaj(n, n);
        CommonOps_DDRM.transpose(a, transposed);
        DMatrixRMaj r = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransA(measuredRow, measuredRow, r);
        CommonOps_DDRM.scale(-1 / measurementIntensity, r);
        DMatrixRMaj q = new DMatrixRMaj(n, n);
        CommonOps_DDRM.multTransB(disturbance, disturbance, q);
        CommonOps_DDRM.scale(processIntensity, q);
        RiccatiSolution solution = riccati.solve(transposed, r, q);
        DMatrixRMaj y = solution.p();
        DMatrixRMaj l = new DMatrixRMaj(n, 1);
        CommonOps_DDRM.multTransB(y, measuredRow, l);
        CommonOps_DDRM.scale(1 / measurementIntensity, l);
        return new ObserverDesign(
                ObserverDesign.Method.STEADY_STATE_KALMAN,
                l.data.clone(),
                errorPoles(a, l, measuredRow),
                y,
                solution.relativeResidual(),
                processIntensity,
                measurementIntensity,
                null);
    }

    /**
     * @param controllerPoles the poles of the plain state-feedback loop (n of them)
     * @param multiple        the observer poles at multiple x those poles, &gt; 0
     * @throws IllegalArgumentException when (A, C_m) is not observable in double precision
     */
    public ObserverDesign poleMultiple(
            DMatrixRMaj a, DMatrixRMaj measuredRow, DesiredPoles controllerPoles, double multiple) {
        if (!(multiple > 0) || !Double.isFinite(multiple)) {
            throw new IllegalArgumentException("the observer pole multiple must be positive and finite");
        }
        int n = a.numRows;
        if (controllerPoles.order() != n) {
            throw new IllegalArgumentException("need " + n + " controller poles, got " + controllerPoles.order());
        }
        TargetDynamics dominant = controllerPoles.dominant();
        List<TargetDynamics.Pole> auxiliary = new ArrayList<>();
        for (TargetDynamics.Pole p : controllerPoles.auxiliary()) {
            auxiliary.add(new TargetDynamics.Pole(multiple * p.re(), multiple * p.im()));
        }
        DesiredPoles observerPoles = new DesiredPoles(
                new TargetDynamics(dominant.dampingRatio(), multiple * dominant.naturalFrequencyRadPerSec()),
                auxiliary);
        double[] alpha = observerPoles.coefficients();
        // phi(A) = A^n + alpha_{n-1} A^{n-1} + ... + alpha_0 I, by Horner's rule
        DMatrixRMaj phi = CommonOps_DDRM.identity(n);
        for (int i = n - 1; i >= 0; i--) {
            DMatrixRMaj next = new DMatrixRMaj(n, n);
            CommonOps_DDRM.mult(phi, a, next);
            for (int j = 0; j < n; j++) {
                next.add(j, j, alpha[i]);
            }
            phi = next;
        }
        // O = [C; C A; ...; C A^{n-1}]
        DMatrixRMaj observability = new DMatrixRMaj(n, n);
        DMatrixRMaj row = measuredRow.copy();
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                observability.set(i, j, row.get(0, j));
            }
            DMatrixRMaj next = new DMatrixRMaj(1, n);
            CommonOps_DDRM.mult(row, a, next);
            row = next;
        }
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(n);
        if (!(1 / NormOps_DDRM.conditionP2(observability) > MIN_RECIPROCAL_CONDITION)
                || !lu.setA(observability.copy())) {
            throw new IllegalArgumentException("the plant state is not observable from the measured output");
        }
        DMatrixRMaj lastUnit = new DMatrixRMaj(n, 1);
        lastUnit.set(n - 1, 0, 1);
        DMatrixRMaj solved = new DMatrixRMaj(n, 1);
        lu.solve(lastUnit, solved);
        DMatrixRMaj l = new DMatrixRMaj(n, 1);
        CommonOps_DDRM.mult(phi, solved, l);
        return new ObserverDesign(
                ObserverDesign.Method.POLE_MULTIPLE,
                l.data.clone(),
                errorPoles(a, l, measuredRow),
                null,
                null,
                null,
                null,
                multiple);
    }

    /** Eigenvalues of A - L C_m. */
    static List<TargetDynamics.Pole> errorPoles(DMatrixRMaj a, DMatrixRMaj l, DMatrixRMaj measuredRow) {
        DMatrixRMaj error = a.copy();
        CommonOps_DDRM.multAdd(-1, l, measuredRow, error);
        EigenDecomposition_F64<DMatrixRMaj> eig = DecompositionFactory_DDRM.eig(error.numRows, false);
        if (!eig.decompose(error)) {
            throw new IllegalArgumentException("the observer poles could not be computed");
        }
        List<TargetDynamics.Pole> poles = new ArrayList<>();
        for (int i = 0; i < eig.getNumberOfEigenvalues(); i++) {
            poles.add(new TargetDynamics.Pole(eig.getEigenvalue(i).real, eig.getEigenvalue(i).imaginary));
        }
        return poles;
    }
}
