package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ObserverDesign;
import com.loopwright.solver.design.TrackingLaw;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.TwoStateModel;
import com.loopwright.solver.riccati.RiccatiResidual;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.Complex_F64;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.DecompositionFactory_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.decomposition.EigenDecomposition_F64;
import org.ejml.interfaces.linsol.LinearSolverDense;

/** Takes a design made in canonical coordinates z back to the caller's coordinates x = T z. */
public final class CallerCoordinates {

    private CallerCoordinates() {}

    public static StateSpaceDesign of(TwoStateModel model, ClosedFormDesign design) {
        DMatrixRMaj t = model.transform();
        DMatrixRMaj tInv = model.inverseTransform();
        DMatrixRMaj pz = new DMatrixRMaj(new double[][] {{design.p11(), design.p12()}, {design.p12(), design.p22()}});
        DMatrixRMaj qz =
                new DMatrixRMaj(new double[][] {{design.rho1() * design.rho1(), 0}, {0, design.rho2() * design.rho2()}
                });
        DMatrixRMaj kz = new DMatrixRMaj(1, 2, true, design.positionGain(), design.velocityGain());
        DMatrixRMaj px = congruence(tInv, pz);
        DMatrixRMaj qx = congruence(tInv, qz);
        DMatrixRMaj kx = callerRow(model, design.plant(), design.positionGain(), design.velocityGain());
        DMatrixRMaj trackedOutput = new DMatrixRMaj(1, 2, true, tInv.get(0, 0) + 0.0, tInv.get(0, 1) + 0.0);

        // R = B1 B1'/gamma^2 - B2 B2' from the caller's own B1 and B2.
        DMatrixRMaj b1 = model.b1();
        DMatrixRMaj b2 = model.b2();
        DMatrixRMaj r = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.multTransB(b2, b2, r);
        CommonOps_DDRM.scale(-1, r);
        if (design.plant().d() != 0) {
            DMatrixRMaj b1b1 = new DMatrixRMaj(2, 2);
            CommonOps_DDRM.multTransB(b1, b1, b1b1);
            CommonOps_DDRM.addEquals(r, 1 / (design.gamma() * design.gamma()), b1b1);
        }
        double residual = RiccatiResidual.relative(model.a(), r, qx, px);

        DMatrixRMaj closedLoop = model.a();
        DMatrixRMaj b2k = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.mult(b2, kx, b2k);
        CommonOps_DDRM.subtractEquals(closedLoop, b2k);
        double referenceGain = callerReferenceGain(closedLoop, b2, trackedOutput, design.referenceGain());
        EigenDecomposition_F64<DMatrixRMaj> eigen = DecompositionFactory_DDRM.eig(2, false);
        List<TargetDynamics.Pole> poles = new ArrayList<>();
        if (eigen.decompose(closedLoop.copy())) {
            for (int i = 0; i < eigen.getNumberOfEigenvalues(); i++) {
                Complex_F64 value = eigen.getEigenvalue(i);
                poles.add(new TargetDynamics.Pole(value.real, value.imaginary));
            }
        }
        return new StateSpaceDesign(
                t, px, kx, qx, trackedOutput, referenceGain, residual, poles, model.controllabilityCondition(), null);
    }

    /**
     * The loop's law in the caller's coordinates: K_x = K_z T^-1 (as the plain gain), L_x = T L_z; ki and kr as
     * designed.
     *
     * @param plant    the canonical plant the law was designed for
     * @param law      u = kr r + ki xi - K_z z_hat
     * @param observer the observer of z, or null with full-state sensing
     */
    public static CallerLoopLaw loopLaw(
            TwoStateModel model, CanonicalPlant plant, TrackingLaw law, ObserverDesign observer) {
        double[] k = law.stateGain();
        DMatrixRMaj kx = callerRow(model, plant, k[0], k[1]);
        DMatrixRMaj lx = null;
        if (observer != null) {
            double[] l = observer.gain();
            lx = new DMatrixRMaj(2, 1);
            CommonOps_DDRM.mult(model.transform(), new DMatrixRMaj(2, 1, true, l[0], l[1]), lx);
        }
        DMatrixRMaj tInv = model.inverseTransform();
        DMatrixRMaj trackedOutput = new DMatrixRMaj(1, 2, true, tInv.get(0, 0) + 0.0, tInv.get(0, 1) + 0.0);
        Double integralGain = law.integralAction() ? law.integralGain() : null;
        return new CallerLoopLaw(kx, integralGain, law.referenceGain(), lx, trackedOutput);
    }

    /**
     * K_x = K_z T^-1 = (K_z C_z) C_x^-1 for K_z = [k1, k2]: an LU solve with the caller's controllability matrix
     * C_x, no explicit inverse (C_z = [B_z, A_z B_z] = [[0, b], [b, -a1 b]]).
     */
    private static DMatrixRMaj callerRow(TwoStateModel model, CanonicalPlant plant, double k1, double k2) {
        double b = plant.b();
        double a1 = plant.a1();
        DMatrixRMaj kzCz = new DMatrixRMaj(1, 2, true, k2 * b, k1 * b - a1 * b * k2);
        return TwoStateModel.solveTransposed(model.controllabilityMatrix(), kzCz);
    }

    /**
     * kr for unit DC gain of the law as stated in the caller's coordinates: y_inf = c x_inf with
     * (A - B2 K_x) x_inf = -B2 kr, so kr = 1 / (c x) for the LU solution of (A - B2 K_x) x = -B2. This takes the
     * DC gain from the caller's own closed loop instead of through the canonical form, so the reported
     * (kr, K_x, c) give y_inf = r to rounding even when T is ill-conditioned. Falls back to the canonical kr if
     * the solve fails (a singular closed loop is caught by the verification).
     */
    private static double callerReferenceGain(
            DMatrixRMaj closedLoop, DMatrixRMaj b2, DMatrixRMaj c, double canonicalReferenceGain) {
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(2);
        if (!lu.setA(closedLoop.copy())) {
            return canonicalReferenceGain;
        }
        DMatrixRMaj minusB2 = b2.copy();
        CommonOps_DDRM.scale(-1, minusB2);
        DMatrixRMaj x = new DMatrixRMaj(2, 1);
        lu.solve(minusB2, x);
        double dcPerKr = c.get(0) * x.get(0) + c.get(1) * x.get(1);
        double kr = 1 / dcPerKr;
        return Double.isFinite(kr) && kr != 0 ? kr : canonicalReferenceGain;
    }

    /** S' M S, symmetrized. */
    private static DMatrixRMaj congruence(DMatrixRMaj s, DMatrixRMaj m) {
        DMatrixRMaj ms = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.mult(m, s, ms);
        DMatrixRMaj out = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.multTransA(s, ms, out);
        double offDiagonal = 0.5 * (out.get(0, 1) + out.get(1, 0));
        out.set(0, 1, offDiagonal);
        out.set(1, 0, offDiagonal);
        return out;
    }
}
