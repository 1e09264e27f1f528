package com.loopwright.solver.highorder;

import static org.junit.jupiter.api.Assertions.*;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.HighOrderDesign;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.spec.DesiredPoles;
import com.loopwright.solver.spec.TargetDynamics;
import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.RandomMatrices_DDRM;
import org.junit.jupiter.api.Test;

class CompanionTransformTest {

    /**
     * Random seeded state spaces: T^-1 A T is the companion matrix and T^-1 B2 = e_n (checked by matrix products),
     * and the design carried back to x (P_x = T^-T P_z T^-1) solves the Riccati equation of the original
     * coordinates with Q_x = T^-T Q_z T^-1, checked against the numeric Hamiltonian solver.
     */
    @Test
    void transformedDesignSolvesTheOriginalRiccatiEquation() {
        Random random = new Random(7);
        for (int n = 3; n <= 6; n++) {
            DMatrixRMaj a = RandomMatrices_DDRM.rectangle(n, n, -1, 1, random);
            DMatrixRMaj b2 = RandomMatrices_DDRM.rectangle(n, 1, -1, 1, random);
            DMatrixRMaj b1 = RandomMatrices_DDRM.rectangle(n, 1, -1, 1, random);
            DMatrixRMaj c = RandomMatrices_DDRM.rectangle(1, n, -1, 1, random);
            CompanionTransform.Result result = new CompanionTransform().transform(a, b2, b1, c);
            DMatrixRMaj t = result.toPlant();
            DMatrixRMaj tInverse = result.toCompanion();
            DMatrixRMaj companion = product(tInverse, product(a, t));
            DMatrixRMaj expected = result.plant().stateMatrix();
            CommonOps_DDRM.subtractEquals(companion, expected);
            assertTrue(NormOps_DDRM.normF(companion) < 1e-9 * NormOps_DDRM.normF(expected), "T^-1 A T, n=" + n);
            DMatrixRMaj unit = product(tInverse, b2);
            assertEquals(1, unit.get(n - 1, 0), 1e-9);
            HighOrderDesign design = new HighOrderDesigner()
                    .design(
                            result.plant(),
                            DesiredPoles.atMultiple(new TargetDynamics(0.8, 2), n, 3),
                            new GammaChoice.MarginOverMinimum(1.2));
            DMatrixRMaj px = congruence(tInverse, design.solution().p());
            DMatrixRMaj qx = congruence(
                    tInverse, PoleMatchedRiccati.weightMatrix(design.solution().weightsSquared()));
            double u = 1 / (design.gamma() * design.gamma());
            DMatrixRMaj r = new DMatrixRMaj(n, n);
            CommonOps_DDRM.multTransB(u, b1, b1, r);
            CommonOps_DDRM.multAddTransB(-1, b2, b2, r);
            RiccatiSolution reference = new HamiltonianRiccatiSolver().solve(a, r, qx);
            DMatrixRMaj diff = reference.p();
            CommonOps_DDRM.subtractEquals(diff, px);
            assertTrue(NormOps_DDRM.normF(diff) < 1e-7 * NormOps_DDRM.normF(px), "P_x, n=" + n);
        }
    }

    @Test
    void uncontrollablePairIsRejected() {
        DMatrixRMaj a = new DMatrixRMaj(new double[][] {{-1, 0, 0}, {0, -2, 0}, {0, 0, -3}});
        DMatrixRMaj b2 = new DMatrixRMaj(new double[][] {{1}, {1}, {0}});
        assertThrows(
                CompanionTransform.UncontrollableException.class,
                () -> new CompanionTransform().transform(a, b2, b2, new DMatrixRMaj(new double[][] {{1, 0, 0}})));
    }

    private static DMatrixRMaj product(DMatrixRMaj x, DMatrixRMaj y) {
        DMatrixRMaj out = new DMatrixRMaj(x.numRows, y.numCols);
        CommonOps_DDRM.mult(x, y, out);
        return out;
    }

    /** S' M S. */
    private static DMatrixRMaj congruence(DMatrixRMaj s, DMatrixRMaj m) {
        DMatrixRMaj ms = product(m, s);
        DMatrixRMaj out = new DMatrixRMaj(s.numCols, s.numCols);
        CommonOps_DDRM.multTransA(s, ms, out);
        return out;
    }
}
