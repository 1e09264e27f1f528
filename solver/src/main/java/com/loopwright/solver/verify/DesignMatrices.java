package com.loopwright.solver.verify;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.plant.CanonicalPlant;
import org.ejml.data.DMatrixRMaj;

/**
 * The state-space matrices of a closed-form design:
 * <pre>
 *   A = [[0, 1], [-a0, -a1]],  B1 = [0, d]',  B2 = [0, b]',  Q = C1'C1 = diag(rho1^2, rho2^2),
 *   R = B1 B1'/gamma^2 - B2 B2',  K = [k1, k2],  A_cl = A - B2 K,
 *   z = C_z x with C_z = [[rho1, 0], [0, rho2], [-k1, -k2]] (the u row is u = -K x).
 * </pre>
 */
record DesignMatrices(
        DMatrixRMaj a,
        DMatrixRMaj b1,
        DMatrixRMaj b2,
        DMatrixRMaj q,
        DMatrixRMaj r,
        DMatrixRMaj p,
        DMatrixRMaj closedLoop,
        DMatrixRMaj performanceOutput) {

    static DesignMatrices of(ClosedFormDesign design) {
        CanonicalPlant plant = design.plant();
        double k1 = design.positionGain();
        double k2 = design.velocityGain();
        double disturbanceCurvature = plant.d() == 0 ? 0 : plant.d() * plant.d() / (design.gamma() * design.gamma());
        return new DesignMatrices(
                new DMatrixRMaj(new double[][] {{0, 1}, {-plant.a0(), -plant.a1()}}),
                new DMatrixRMaj(new double[][] {{0}, {plant.d()}}),
                new DMatrixRMaj(new double[][] {{0}, {plant.b()}}),
                new DMatrixRMaj(new double[][] {{design.rho1() * design.rho1(), 0}, {0, design.rho2() * design.rho2()}
                }),
                new DMatrixRMaj(new double[][] {{0, 0}, {0, disturbanceCurvature - plant.b() * plant.b()}}),
                new DMatrixRMaj(new double[][] {{design.p11(), design.p12()}, {design.p12(), design.p22()}}),
                new DMatrixRMaj(new double[][] {{0, 1}, {-plant.a0() - plant.b() * k1, -plant.a1() - plant.b() * k2}}),
                new DMatrixRMaj(new double[][] {{design.rho1(), 0}, {0, design.rho2()}, {-k1, -k2}}));
    }
}
