package com.loopwright.solver.riccati;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.design.ClosedFormDesigner;
import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.spec.TargetDynamics;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.junit.jupiter.api.Test;

/**
 * An unstable plant with a weak actuator and a strong disturbance gives Q of order 1e10 and R of order 1e-3:
 * unbalanced, the Hamiltonian is numerically singular. Balancing P = s Ps must recover the closed form
 * (source: the project's closed-form design, itself checked against Hipparchus elsewhere).
 */
class BadlyScaledRiccatiTest {

    @Test
    void balancedSolveRecoversTheClosedForm() {
        CanonicalPlant plant = new CanonicalPlant(-13.04, 0.514, -0.1011, 308.0);
        ClosedFormDesign design = new ClosedFormDesigner()
                .design(plant, new TargetDynamics(0.83, 130), new GammaChoice.MarginOverMinimum(1.2));
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{0, 1}, {-plant.a0(), -plant.a1()}});
        double k = design.riccatiCurvature();
        DMatrixRMaj r = new DMatrixRMaj(new double[][] {{0, 0}, {0, -k}});
        DMatrixRMaj q =
                new DMatrixRMaj(new double[][] {{design.rho1() * design.rho1(), 0}, {0, design.rho2() * design.rho2()}
                });
        assertTrue(NormOps_DDRM.normF(q) / NormOps_DDRM.normF(r) > 1e10, "the case is badly scaled");
        RiccatiSolution solution = new HamiltonianRiccatiSolver().solve(a, r, q);
        DMatrixRMaj closed =
                new DMatrixRMaj(new double[][] {{design.p11(), design.p12()}, {design.p12(), design.p22()}});
        DMatrixRMaj difference = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.subtract(solution.p(), closed, difference);
        assertEquals(0, NormOps_DDRM.normF(difference) / NormOps_DDRM.normF(closed), 1e-9);
        assertTrue(solution.relativeResidual() < 1e-12);
    }
}
