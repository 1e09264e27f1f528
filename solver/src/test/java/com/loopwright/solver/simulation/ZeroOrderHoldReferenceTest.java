package com.loopwright.solver.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.loopwright.solver.linalg.MatrixExponential;
import com.loopwright.solver.loop.LoopMatrices;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

/** The plant hold used by the sampled-loop simulation against closed forms. */
class ZeroOrderHoldReferenceTest {

    @Test
    void doubleIntegratorMatchesTheClosedForm() {
        // Ad = [[1, T], [0, 1]], Bd = [T^2/2, T]' (Franklin, Powell and Workman, Digital Control of Dynamic
        // Systems, the double-integrator example; also /work/shared/method.md section 5)
        for (double t : new double[] {1e-4, 0.01, 0.3, 2.5}) {
            DiscreteStateSpace hold = ZeroOrderHold.discretize(
                    LoopMatrices.openLoop(new com.loopwright.solver.plant.CanonicalPlant(0, 0, 1, 0)),
                    new DMatrixRMaj(new double[][] {{0}, {1}}),
                    t);
            DMatrixRMaj ad = hold.ad();
            DMatrixRMaj bd = hold.bd();
            assertEquals(1, ad.get(0, 0), 1e-15);
            assertEquals(t, ad.get(0, 1), 1e-15 * Math.max(1, t));
            assertEquals(0, ad.get(1, 0), 1e-15);
            assertEquals(1, ad.get(1, 1), 1e-15);
            assertEquals(t * t / 2, bd.get(0, 0), 1e-15 * Math.max(1, t * t));
            assertEquals(t, bd.get(1, 0), 1e-15 * Math.max(1, t));
        }
    }

    @Test
    void holdSatisfiesTheMatrixExponentialIdentity() {
        // Ad = e^(A T) and, for invertible A, A Bd = (Ad - I) B since Bd = integral_0^T e^(A s) ds B
        // (standard identity; any sampled-data text). Plant: a gimbal axis with stiffness and damping.
        com.loopwright.solver.plant.CanonicalPlant plant = new com.loopwright.solver.plant.CanonicalPlant(40, 3, 25, 1);
        DMatrixRMaj a = LoopMatrices.openLoop(plant);
        DMatrixRMaj b = LoopMatrices.actuatorInput(plant);
        double t = 0.07;
        DiscreteStateSpace hold = ZeroOrderHold.discretize(a, b, t);
        DMatrixRMaj scaled = a.copy();
        CommonOps_DDRM.scale(t, scaled);
        DMatrixRMaj expected = MatrixExponential.of(scaled);
        DMatrixRMaj ad = hold.ad();
        for (int i = 0; i < 4; i++) {
            assertEquals(expected.data[i], ad.data[i], 1e-14);
        }
        DMatrixRMaj left = new DMatrixRMaj(2, 1);
        CommonOps_DDRM.mult(a, hold.bd(), left);
        DMatrixRMaj adMinusI = ad.copy();
        adMinusI.add(0, 0, -1);
        adMinusI.add(1, 1, -1);
        DMatrixRMaj right = new DMatrixRMaj(2, 1);
        CommonOps_DDRM.mult(adMinusI, b, right);
        assertEquals(right.get(0, 0), left.get(0, 0), 1e-12);
        assertEquals(right.get(1, 0), left.get(1, 0), 1e-12);
    }
}
